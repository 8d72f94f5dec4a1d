import { createHash } from 'node:crypto';
import type { z } from 'zod';
import { inTransaction } from '@/db';
import { appendEvent, caseRefs } from '@/db/cases';
import { answersInLastHour, getNoticeByTokenHash, insertAnswer, listAnswers, lockNotice, type NoticeRow } from '@/db/notices';
import { notFound, tooManyRequests } from '@/lib/errors';
import { ANSWER_KINDS, type answerSchema } from '@/lib/validation/notices';
import { queueCommitteeAlert } from './alerts';
import { appUrl } from './config';
import { hashResponseToken, looksLikeToken } from './token';
import { longDate, renderFrozen } from './values';

/** Answers per response link and per client address in one hour. */
export const ANSWER_LIMITS = { perToken: 5, perClient: 20 } as const;

const LINK_STATUSES = ['approved', 'queued', 'sent', 'failed', 'hand-delivered'];
/** Wrong, expired or withdrawn: always the same plain 404, so a guess learns nothing. */
const gone = () => notFound('This link does not work. It may have expired; the club’s letter gives another way to reach them.');

async function noticeForToken(token: string): Promise<NoticeRow & { frozen: NonNullable<NoticeRow['frozen']> }> {
  if (!looksLikeToken(token)) throw gone();
  const n = await getNoticeByTokenHash(hashResponseToken(token));
  if (!n?.frozen || !LINK_STATUSES.includes(n.status) || !n.tokenExpiresAt || new Date(n.tokenExpiresAt) <= new Date()) throw gone();
  return { ...n, frozen: n.frozen };
}

/** What the recipient's page shows: the notice as sent and the answers so far. Nothing about the reporter beyond what the notice says. */
export type RecipientView = {
  clubName: string;
  clubContactEmail: string;
  subject: string;
  text: string;
  html: string;
  noticeDate: string;
  expiresOn: string;
  answers: { kind: keyof typeof ANSWER_KINDS; label: string; on: string }[];
};

export async function recipientView(token: string): Promise<RecipientView> {
  const n = await noticeForToken(token);
  const m = renderFrozen(n);
  const answers = await listAnswers(n.id);
  return {
    clubName: n.frozen.values.clubName ?? '',
    clubContactEmail: n.frozen.values.clubContactEmail ?? '',
    subject: m.subject,
    text: m.text,
    html: m.html,
    noticeDate: n.frozen.values.noticeDate ?? '',
    expiresOn: longDate(n.tokenExpiresAt!),
    answers: answers.map((a) => ({ kind: a.kind, label: ANSWER_KINDS[a.kind], on: longDate(a.createdAt) })),
  };
}

const clientHash = (client: string) => createHash('sha256').update(`quietfix-answer:${client}`).digest('hex');

/** Records an answer: timeline entry for the committee and an alert e-mail through the outbox, in one transaction. */
export async function recordAnswer(token: string, client: string, a: z.output<typeof answerSchema>): Promise<{ id: string }> {
  const found = await noticeForToken(token);
  const ch = clientHash(client);
  return inTransaction(async (trx) => {
    const n = (await lockNotice(trx, found.id))!; // serialises answers on one link, so the limit holds
    if ((await answersInLastHour(trx, { noticeId: n.id })) >= ANSWER_LIMITS.perToken || (await answersInLastHour(trx, { clientHash: ch })) >= ANSWER_LIMITS.perClient) {
      throw tooManyRequests('Thank you, we already have several answers from you in the last hour. Please try again later or write to the club.', 3600);
    }
    const saved = await insertAnswer(trx, { noticeId: n.id, kind: a.kind, message: a.message, contact: a.contact, clientHash: ch });
    const [c] = await caseRefs(trx, [n.caseId]);
    await appendEvent(trx, {
      caseId: n.caseId,
      actorId: null,
      kind: 'recipient-answered',
      data: { noticeId: n.id, answerId: saved.id, answer: a.kind, label: ANSWER_KINDS[a.kind], text: a.message || undefined, contact: a.contact || undefined, recipientName: n.recipientName },
      visibility: 'committee',
    });
    await queueCommitteeAlert(trx, {
      key: `answer:${saved.id}`,
      caseId: n.caseId,
      subject: `${c.reference}: ${n.recipientName} answered — ${ANSWER_KINDS[a.kind]}`,
      lines: [
        `${n.recipientName} (${n.postalAddress.replace(/\s*\n\s*/g, ', ')}) answered the notice on ${c.reference}, "${c.title}".`,
        `Answer: ${ANSWER_KINDS[a.kind]}`,
        ...(a.message ? [`Their words: ${a.message}`] : []),
        ...(a.contact ? [`How to reach them: ${a.contact}`] : []),
        `The case: ${appUrl(`/cases/${n.caseId}`)}`,
      ],
    });
    return { id: saved.id };
  });
}

