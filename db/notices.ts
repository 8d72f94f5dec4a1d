import type { Knex } from 'knex';
import { db } from './index';
import type { TemplateKey, PlaceholderValues } from '@/lib/notices/templates';
import { whereCaseRight } from './case-scope';
import type { Role } from './types';

export const NOTICE_STATUSES = ['draft', 'approved', 'queued', 'sent', 'failed', 'hand-delivered'] as const;
export type NoticeStatus = (typeof NOTICE_STATUSES)[number];
/** Statuses that hold the household's one place on a case (the partial unique index). */
export const ACTIVE_STATUSES: NoticeStatus[] = ['draft', 'approved', 'queued', 'failed'];

/** What was approved: the template texts and the placeholder values (without the link). */
export type FrozenNotice = { subject: string; body: string; values: PlaceholderValues };

export type NoticeRow = {
  id: string;
  caseId: string;
  templateKey: TemplateKey;
  status: NoticeStatus;
  recipientName: string;
  postalAddress: string;
  addressKey: string;
  email: string | null;
  personalNote: string;
  createdBy: string | null;
  approvedBy: string | null;
  approvedAt: Date | null;
  frozen: FrozenNotice | null;
  tokenNonce: string | null;
  tokenExpiresAt: Date | null;
  sentAt: Date | null;
  deliveredOn: string | null;
  followUpOf: string | null;
  version: number;
  createdAt: Date;
  updatedAt: Date;
};

const COLUMNS = {
  id: 'n.id',
  caseId: 'n.case_id',
  templateKey: 'n.template_key',
  status: 'n.status',
  recipientName: 'n.recipient_name',
  postalAddress: 'n.postal_address',
  addressKey: 'n.address_key',
  email: 'n.email',
  personalNote: 'n.personal_note',
  createdBy: 'n.created_by',
  approvedBy: 'n.approved_by',
  approvedAt: 'n.approved_at',
  frozen: 'n.frozen',
  tokenNonce: 'n.token_nonce',
  tokenExpiresAt: 'n.token_expires_at',
  sentAt: 'n.sent_at',
  deliveredOn: db.raw("to_char(n.delivered_on, 'YYYY-MM-DD')"),
  followUpOf: 'n.follow_up_of',
  version: 'n.version',
  createdAt: 'n.created_at',
  updatedAt: 'n.updated_at',
} as const;

/** A notice with how its e-mail is getting on (the outbox row, if any). */
export type NoticeListRow = NoticeRow & {
  outboxStatus: 'pending' | 'sent' | 'failed' | null;
  attempts: number | null;
  lastError: string | null;
  nextAttemptAt: Date | null;
  createdByName: string | null;
  approvedByName: string | null;
  answers: number;
};

export async function getNotice(id: string, q: Knex = db): Promise<NoticeRow | undefined> {
  return q('notices as n').select(COLUMNS).where('n.id', id).first();
}

export async function lockNotice(trx: Knex.Transaction, id: string): Promise<NoticeRow | undefined> {
  return trx('notices as n').select(COLUMNS).where('n.id', id).forUpdate().first();
}

export async function getNoticeByTokenHash(hash: string, q: Knex = db): Promise<NoticeRow | undefined> {
  return q('notices as n').select(COLUMNS).where('n.token_hash', hash).first();
}

export async function listNotices(caseId: string, q: Knex = db): Promise<NoticeListRow[]> {
  return q('notices as n')
    .leftJoin('outbox as o', function () {
      this.on('o.notice_id', 'n.id').andOnVal('o.kind', 'notice');
    })
    .leftJoin('users as cu', 'cu.id', 'n.created_by')
    .leftJoin('users as au', 'au.id', 'n.approved_by')
    .select({
      ...COLUMNS,
      outboxStatus: 'o.status',
      attempts: 'o.attempts',
      lastError: 'o.last_error',
      nextAttemptAt: 'o.next_attempt_at',
      createdByName: 'cu.name',
      approvedByName: 'au.name',
      answers: q.raw('(select count(*)::int from notice_answers a where a.notice_id = n.id)'),
    })
    .where('n.case_id', caseId)
    .orderBy('n.created_at', 'desc');
}

/** The notice already holding this household's place on the case, if any. */
export async function activeNoticeAt(q: Knex, caseId: string, key: string, excludeId?: string): Promise<NoticeRow | undefined> {
  return q('notices as n')
    .select(COLUMNS)
    .where({ 'n.case_id': caseId, 'n.address_key': key })
    .whereIn('n.status', ACTIVE_STATUSES)
    .modify((b) => (excludeId ? b.whereNot('n.id', excludeId) : b))
    .first();
}

/**
 * Open notices to the same household on other unresolved cases that `viewer` may see: the
 * composer warns about them (the routes ask only for the committee, who see every case).
 */
export async function noticesAtAddressElsewhere(
  viewer: { id: string; role: Role },
  key: string,
  caseId: string,
  q: Knex = db,
): Promise<{ caseId: string; reference: string; title: string; status: NoticeStatus }[]> {
  if (!key) return [];
  const b = q('notices as n')
    .join('cases as c', 'c.id', 'n.case_id')
    .distinctOn('c.id')
    .select({ caseId: 'c.id', reference: 'c.reference', title: 'c.title', status: 'n.status' })
    .where('n.address_key', key)
    .whereNot('n.case_id', caseId)
    .whereNot('c.status', 'resolved')
    .orderBy([{ column: 'c.id' }, { column: 'n.created_at', order: 'desc' }]);
  return whereCaseRight(b, viewer, 'view');
}

export async function insertNotice(
  trx: Knex,
  n: Pick<NoticeRow, 'caseId' | 'templateKey' | 'recipientName' | 'postalAddress' | 'addressKey' | 'email' | 'personalNote' | 'createdBy'> & { followUpOf?: string | null },
): Promise<NoticeRow> {
  const [{ id }] = await trx('notices')
    .insert({
      case_id: n.caseId,
      template_key: n.templateKey,
      recipient_name: n.recipientName,
      postal_address: n.postalAddress,
      address_key: n.addressKey,
      email: n.email,
      personal_note: n.personalNote,
      created_by: n.createdBy,
      follow_up_of: n.followUpOf ?? null,
    })
    .returning('id');
  return (await getNotice(id, trx))!;
}

const WRITABLE = {
  templateKey: 'template_key',
  status: 'status',
  recipientName: 'recipient_name',
  postalAddress: 'postal_address',
  addressKey: 'address_key',
  email: 'email',
  personalNote: 'personal_note',
  approvedBy: 'approved_by',
  approvedAt: 'approved_at',
  tokenNonce: 'token_nonce',
  tokenExpiresAt: 'token_expires_at',
  sentAt: 'sent_at',
  deliveredOn: 'delivered_on',
} as const;
export type NoticeChanges = Partial<{ [K in keyof typeof WRITABLE]: NoticeRow[K] }> & { frozen?: FrozenNotice | null; tokenHash?: string | null };

/** Writes changes and bumps the version; the caller holds the row lock. */
export async function writeNotice(trx: Knex, id: string, changes: NoticeChanges): Promise<void> {
  const cols: Record<string, unknown> = { version: trx.raw('version + 1'), updated_at: trx.fn.now() };
  for (const [k, col] of Object.entries(WRITABLE)) {
    const v = changes[k as keyof typeof WRITABLE];
    if (v !== undefined) cols[col] = v;
  }
  if (changes.frozen !== undefined) cols.frozen = changes.frozen === null ? null : JSON.stringify(changes.frozen);
  if (changes.tokenHash !== undefined) cols.token_hash = changes.tokenHash;
  await trx('notices').where({ id }).update(cols);
}

export type AnswerKind = 'will-check' | 'not-mine' | 'contact-me' | 'fixed-it' | 'other';

export async function insertAnswer(trx: Knex, a: { noticeId: string; kind: AnswerKind; message: string; contact: string; clientHash: string }): Promise<{ id: string; createdAt: Date }> {
  const [row] = await trx('notice_answers')
    .insert({ notice_id: a.noticeId, kind: a.kind, message: a.message, contact: a.contact, client_hash: a.clientHash })
    .returning(['id', 'created_at']);
  return { id: String(row.id), createdAt: row.created_at };
}

/** Answers in the last hour, for the per-link and per-client limits. */
export async function answersInLastHour(q: Knex, by: { noticeId?: string; clientHash?: string }): Promise<number> {
  const [{ n }] = await q('notice_answers')
    .where('created_at', '>', q.raw("now() - interval '1 hour'"))
    .modify((b) => (by.noticeId ? b.where('notice_id', by.noticeId) : b.where('client_hash', by.clientHash!)))
    .count<{ n: string }[]>({ n: '*' });
  return Number(n);
}

export async function listAnswers(noticeId: string, q: Knex = db): Promise<{ kind: AnswerKind; createdAt: Date }[]> {
  return q('notice_answers').select({ kind: 'kind', createdAt: 'created_at' }).where('notice_id', noticeId).orderBy('id');
}

/** First notices that got no answer within the club's reminder days on a notified case, not yet checked. */
export async function dueForReminder(q: Knex, reminderDays: number, limit: number): Promise<{ id: string; caseId: string }[]> {
  return q('notices as n')
    .join('cases as c', 'c.id', 'n.case_id')
    .select({ id: 'n.id', caseId: 'n.case_id' })
    .whereIn('n.status', ['sent', 'hand-delivered'])
    .where('n.template_key', 'first-notice')
    .whereNull('n.reminder_checked_at')
    .where('c.status', 'notified')
    .whereRaw('coalesce(n.sent_at, n.delivered_on::timestamptz) < now() - make_interval(days => ?)', [reminderDays])
    .whereNotExists(q('notice_answers as a').whereRaw('a.notice_id = n.id'))
    .orderBy('n.sent_at')
    .limit(limit);
}

/** Marks a notice's reminder as checked; false when another worker got there first. */
export async function markReminderChecked(trx: Knex.Transaction, id: string): Promise<boolean> {
  return (await trx('notices').where({ id }).whereNull('reminder_checked_at').update({ reminder_checked_at: trx.fn.now() })) > 0;
}

/** When the notice a follow-up refers to went out (sent, delivered, or at least approved). */
export async function firstNoticeDate(q: Knex, id: string): Promise<Date | string | null> {
  const first = await q('notices').where({ id }).first('sent_at', 'delivered_on', 'approved_at');
  return first ? (first.sent_at ?? first.delivered_on ?? first.approved_at) : null;
}

/** Who hears about answers and reminders besides the club's address: the active coordinators. */
export async function activeCoordinatorEmails(q: Knex): Promise<string[]> {
  return q('users').where({ role: 'coordinator', active: true }).pluck('email');
}
