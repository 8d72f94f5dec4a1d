import type { Knex } from 'knex';
import { db } from './index';
import type { TemplateKey } from '@/lib/notices/templates';

export type NoticeTemplate = { key: TemplateKey; title: string; subject: string; body: string; version: number; updatedAt: Date; updatedByName: string | null };

const COLUMNS = { key: 't.key', title: 't.title', subject: 't.subject', body: 't.body', version: 't.version', updatedAt: 't.updated_at', updatedByName: 'u.name' };

export async function listTemplates(q: Knex = db): Promise<NoticeTemplate[]> {
  return q('notice_templates as t').leftJoin('users as u', 'u.id', 't.updated_by').select(COLUMNS).orderByRaw("array_position(array['first-notice','follow-up','thank-you','utility-referral'], t.key)");
}

export async function getTemplate(key: string, q: Knex = db): Promise<NoticeTemplate | undefined> {
  return q('notice_templates as t').leftJoin('users as u', 'u.id', 't.updated_by').select(COLUMNS).where('t.key', key).first();
}

export async function lockTemplate(trx: Knex.Transaction, key: string): Promise<{ key: string; version: number } | undefined> {
  return trx('notice_templates').select('key', 'version').where({ key }).forUpdate().first();
}

export async function writeTemplate(trx: Knex.Transaction, key: string, t: { subject: string; body: string; updatedBy: string }): Promise<void> {
  await trx('notice_templates')
    .where({ key })
    .update({ subject: t.subject, body: t.body, updated_by: t.updatedBy, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
}
