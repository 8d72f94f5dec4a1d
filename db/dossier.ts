import type { Knex } from 'knex';
import { db } from './index';

/** The notices of a case and what came back, for the dossier: no e-mail addresses, no contact details. */
export async function dossierNotices(caseId: string, q: Knex = db) {
  const notices = await q('notices')
    .select({ id: 'id', templateKey: 'template_key', status: 'status', postalAddress: 'postal_address', sentAt: 'sent_at', deliveredOn: 'delivered_on', createdAt: 'created_at' })
    .where({ case_id: caseId })
    .orderBy('created_at');
  const answers = notices.length
    ? await q('notice_answers').select({ noticeId: 'notice_id', kind: 'kind', message: 'message', createdAt: 'created_at' }).whereIn('notice_id', notices.map((n) => n.id)).orderBy('id')
    : [];
  return { notices, answers } as {
    notices: { id: string; templateKey: string; status: string; postalAddress: string; sentAt: Date | null; deliveredOn: string | null; createdAt: Date }[];
    answers: { noticeId: string; kind: string; message: string; createdAt: Date }[];
  };
}
