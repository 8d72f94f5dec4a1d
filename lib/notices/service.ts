import type { Knex } from 'knex';
import type { z } from 'zod';
import { appendEvent } from '@/db/cases';
import type { CaseRow, User } from '@/db/types';
import { activeNoticeAt, insertNotice, lockNotice, writeNotice, type NoticeRow } from '@/db/notices';
import { getNoticeOutbox, getOutboxByIdempotencyKey, insertOutbox, requeue, type OutboxRow } from '@/db/outbox';
import { getTemplate } from '@/db/templates';
import { AppError, conflict, forbidden, notFound } from '@/lib/errors';
import { caseAccess } from '@/lib/hunt/access';
import { lockVisibleCase } from '@/lib/hunt/case-detail';
import { applyTransition, ruleNotMet } from '@/lib/hunt/transitions';
import type { noticeBaseSchema, noticePatchSchema } from '@/lib/validation/notices';
import { addressKey } from './address-key';
import { linkExpiry, messageIdDomain } from './config';
import { deriveToken, hashResponseToken, newNonce } from './token';
import { buildValues } from './values';

/**
 * Who may do what with a case's notices. The assigned hunter may `read`: see that a notice exists
 * and its status. The household's name, address, e-mail, answers and response link (`contact`),
 * composing (`draft`) and approving, sending and recording (`decide`) are the committee's.
 * Everyone else: 403 (the case itself is checked first).
 */
export function noticeAccess(user: User, c: CaseRow) {
  const a = caseAccess(user, c);
  return { read: a.seeHunt, contact: a.committee, draft: a.committee, decide: a.committee };
}
export type NoticeRight = keyof ReturnType<typeof noticeAccess>;

const REFUSALS: Record<NoticeRight, string> = {
  read: 'Notices are for the committee and the assigned hunter.',
  contact: 'The household’s details and the letter are for the committee (coordinators and admins).',
  draft: 'Coordinators write notices; tell them what you found in a comment.',
  decide: 'Only coordinators approve, send and record notices.',
};

export function requireNoticeRight(user: User, c: CaseRow, right: NoticeRight) {
  if (!noticeAccess(user, c)[right]) throw forbidden(REFUSALS[right]);
}

const NOTIFIABLE = ['located', 'notified', 'resolved'];
const isUniqueViolation = (err: unknown) => (err as { code?: string })?.code === '23505';

function householdTaken(other: NoticeRow): AppError {
  return conflict(`This household already has a notice on this case (${other.status}). Edit or finish that one instead of starting another.`, { noticeId: other.id });
}

function staleNotice(n: NoticeRow): AppError {
  return conflict('Someone changed this notice after you loaded it. Reload to see the change, then try again.', { currentVersion: n.version });
}

/** Locks the case (if `me` may see it) and a notice of it, or 404. */
export async function lockCaseNotice(trx: Knex.Transaction, me: User, caseId: string, noticeId: string): Promise<{ c: CaseRow; n: NoticeRow }> {
  const { row: c } = await lockVisibleCase(trx, me, caseId);
  const n = await lockNotice(trx, noticeId);
  if (!n || n.caseId !== caseId) throw notFound('No such notice on this case.');
  return { c, n };
}

type Draft = z.output<typeof noticeBaseSchema>;

export async function createDraft(trx: Knex.Transaction, me: User, caseId: string, input: Draft): Promise<NoticeRow> {
  const { row: c } = await lockVisibleCase(trx, me, caseId);
  requireNoticeRight(me, c, 'draft');
  if (!NOTIFIABLE.includes(c.status)) throw ruleNotMet('Notices are written once the source is located: locate the case first.');
  const key = addressKey(input.postalAddress);
  const other = await activeNoticeAt(trx, caseId, key);
  if (other) throw householdTaken(other);
  try {
    const n = await trx.transaction((sp) =>
      insertNotice(sp, { caseId, ...input, email: input.email || null, addressKey: key, createdBy: me.id }),
    );
    await appendEvent(trx, { caseId, actorId: me.id, kind: 'notice-drafted', data: { noticeId: n.id, template: n.templateKey } });
    return n;
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict('This household already has a notice on this case.');
    throw err;
  }
}

export async function editDraft(trx: Knex.Transaction, me: User, caseId: string, noticeId: string, input: z.output<typeof noticePatchSchema>): Promise<void> {
  const { c, n } = await lockCaseNotice(trx, me, caseId, noticeId);
  requireNoticeRight(me, c, 'draft');
  if (n.version !== input.version) throw staleNotice(n);
  if (n.status !== 'draft') throw ruleNotMet(`This notice is ${n.status}: only drafts can be edited.`);
  const { version: _v, ...changes } = input;
  const key = changes.postalAddress !== undefined ? addressKey(changes.postalAddress) : undefined;
  if (key && key !== n.addressKey) {
    const other = await activeNoticeAt(trx, caseId, key, n.id);
    if (other) throw householdTaken(other);
  }
  await writeNotice(trx, n.id, {
    ...changes,
    ...(changes.email !== undefined ? { email: changes.email || null } : {}),
    ...(key ? { addressKey: key } : {}),
  });
}

/** Freezes the texts and values, makes the response link (nonce) and marks the notice approved. */
export async function approve(trx: Knex.Transaction, me: User, caseId: string, noticeId: string, version: number): Promise<void> {
  const { c, n } = await lockCaseNotice(trx, me, caseId, noticeId);
  requireNoticeRight(me, c, 'decide');
  if (n.version !== version) throw staleNotice(n);
  if (n.status !== 'draft') throw ruleNotMet(`This notice is already ${n.status}.`);
  const tpl = (await getTemplate(n.templateKey, trx))!;
  const nonce = newNonce();
  const expires = linkExpiry();
  const values = await buildValues(trx, c, n, { senderName: me.name, noticeDate: new Date(), expiresOn: expires });
  await writeNotice(trx, n.id, {
    status: 'approved',
    approvedBy: me.id,
    approvedAt: new Date(),
    frozen: { subject: tpl.subject, body: tpl.body, values },
    tokenNonce: nonce,
    tokenHash: hashResponseToken(deriveToken(n.id, nonce)),
    tokenExpiresAt: expires,
  });
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'notice-approved', data: { noticeId: n.id, template: n.templateKey } });
}

/**
 * "Send": the notice becomes queued and its outbox row is written in this one transaction.
 * Idempotent: the same key, or a second click while it is queued or sent, returns the same row.
 */
export async function queueSend(trx: Knex.Transaction, me: User, caseId: string, noticeId: string, idempotencyKey: string): Promise<{ outbox: OutboxRow; created: boolean }> {
  const { c, n } = await lockCaseNotice(trx, me, caseId, noticeId);
  requireNoticeRight(me, c, 'decide');
  const key = `send:${idempotencyKey}`;
  const byKey = await getOutboxByIdempotencyKey(trx, key);
  if (byKey) {
    if (byKey.noticeId !== n.id) throw conflict('This idempotency key was already used for another notice.');
    return { outbox: byKey, created: false };
  }
  const existing = await getNoticeOutbox(trx, n.id);
  if (existing) return { outbox: existing, created: false };
  if (n.status === 'draft') throw ruleNotMet('A coordinator approves the notice before it is sent.');
  if (n.status !== 'approved') throw ruleNotMet(`This notice is ${n.status}; it cannot be sent by e-mail now.`);
  if (!n.email) throw ruleNotMet('This notice has no e-mail address: print the letter and record it as delivered.');
  const outbox = await insertOutbox(trx, {
    kind: 'notice',
    noticeId: n.id,
    caseId,
    idempotencyKey: key,
    messageId: `<notice-${n.id}@${messageIdDomain()}>`,
    toAddress: n.email,
  });
  await writeNotice(trx, n.id, { status: 'queued' });
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'notice-queued', data: { noticeId: n.id } });
  return { outbox, created: true };
}

/** A coordinator tries a failed e-mail again: same row, same Message-ID, fresh tries. */
export async function retrySend(trx: Knex.Transaction, me: User, caseId: string, noticeId: string): Promise<void> {
  const { c, n } = await lockCaseNotice(trx, me, caseId, noticeId);
  requireNoticeRight(me, c, 'decide');
  const row = await getNoticeOutbox(trx, n.id, true);
  if (!row || row.status !== 'failed' || n.status !== 'failed') throw ruleNotMet('Only a notice whose e-mail failed can be tried again.');
  await requeue(trx, row.id);
  await writeNotice(trx, n.id, { status: 'queued' });
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'notice-retried', data: { noticeId: n.id } });
}

/**
 * A printed letter put through the door. The first one moves the case located -> notified
 * through the same transition a coordinator would make by hand (lib/hunt/transitions.ts).
 */
export async function markDelivered(trx: Knex.Transaction, me: User, caseId: string, noticeId: string, deliveredOn: string): Promise<void> {
  const { c, n } = await lockCaseNotice(trx, me, caseId, noticeId);
  requireNoticeRight(me, c, 'decide');
  if (n.status !== 'approved' && n.status !== 'failed') throw ruleNotMet(`This notice is ${n.status}: only an approved letter can be recorded as delivered.`);
  if (new Date(deliveredOn) > new Date()) throw ruleNotMet('The delivery date is in the future.');
  await writeNotice(trx, n.id, { status: 'hand-delivered', deliveredOn });
  if (c.status === 'located') {
    await applyTransition(trx, me, c, { to: 'notified', version: c.version, method: 'hand-delivered', deliveredOn, note: '' });
  }
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'notice-sent', data: { noticeId: n.id, template: n.templateKey, via: 'hand', deliveredOn }, visibility: 'all' });
}
