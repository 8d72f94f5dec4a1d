import type { Knex } from 'knex';
import { JOB, outboxJobKey } from '@/lib/jobs/names';
import { addJob } from './jobs';

/**
 * The outbox: one row per e-mail to send. Rows are written in the same transaction as the
 * change that wants the mail, and delivered by the worker (lib/notices/outbox.ts).
 */
export type OutboxRow = {
  id: string;
  kind: 'notice' | 'alert' | 'account';
  noticeId: string | null;
  caseId: string | null;
  /** account mail: the invitation or reset link it carries (db/user-tokens.ts) */
  userTokenId: string | null;
  idempotencyKey: string;
  messageId: string;
  toAddress: string;
  subject: string | null;
  textBody: string | null;
  htmlBody: string | null;
  status: 'pending' | 'sent' | 'failed';
  attempts: number;
  nextAttemptAt: Date;
  leaseUntil: Date | null;
  leasedBy: string | null;
  lastError: string | null;
  sentAt: Date | null;
  effectsApplied: boolean;
};

const COLUMNS = {
  id: 'id',
  kind: 'kind',
  noticeId: 'notice_id',
  caseId: 'case_id',
  userTokenId: 'user_token_id',
  idempotencyKey: 'idempotency_key',
  messageId: 'message_id',
  toAddress: 'to_address',
  subject: 'subject',
  textBody: 'text_body',
  htmlBody: 'html_body',
  status: 'status',
  attempts: 'attempts',
  nextAttemptAt: 'next_attempt_at',
  leaseUntil: 'lease_until',
  leasedBy: 'leased_by',
  lastError: 'last_error',
  sentAt: 'sent_at',
  effectsApplied: 'effects_applied',
} as const;

const fromDb = (r: Record<string, unknown>): OutboxRow => {
  const out: Record<string, unknown> = {};
  for (const [k, col] of Object.entries(COLUMNS)) out[k] = r[col];
  out.id = String(r.id);
  return out as OutboxRow;
};

export async function insertOutbox(
  trx: Knex,
  r: Pick<OutboxRow, 'kind' | 'noticeId' | 'caseId' | 'idempotencyKey' | 'messageId' | 'toAddress'> & Partial<Pick<OutboxRow, 'subject' | 'textBody' | 'htmlBody' | 'userTokenId'>>,
): Promise<OutboxRow> {
  const [row] = await trx('outbox')
    .insert({
      kind: r.kind,
      notice_id: r.noticeId,
      case_id: r.caseId,
      user_token_id: r.userTokenId ?? null,
      idempotency_key: r.idempotencyKey,
      message_id: r.messageId,
      to_address: r.toAddress,
      subject: r.subject ?? null,
      text_body: r.textBody ?? null,
      html_body: r.htmlBody ?? null,
    })
    .returning('*');
  // Its delivery job commits (or rolls back) with the row.
  await scheduleDelivery(trx, String(row.id));
  return fromDb(row);
}

/** (Re)queues the delivery job of a row for the given time (one job per row: the key). */
export async function scheduleDelivery(q: Knex, id: string, runAt?: Date): Promise<void> {
  await addJob(q, JOB.deliverMail, { outboxId: id }, { jobKey: outboxJobKey(id), runAt });
}

/**
 * Pending rows with no live delivery job: none at all (a crash between two statements), or one
 * locked longer than `staleMs` by a worker that died (graphile-worker frees such locks only after
 * four hours). Answers when each should run: after its backoff and after any lease held on it.
 */
export async function rowsWithoutLiveJob(q: Knex, staleMs: number, limit = 200): Promise<{ id: string; runAt: Date }[]> {
  const { rows } = await q.raw(
    `select o.id, greatest(o.next_attempt_at, coalesce(o.lease_until, o.next_attempt_at)) as run_at
       from outbox o
      where o.status = 'pending'
        and not exists (select 1 from graphile_worker.jobs j
                         where j.key = 'outbox:' || o.id
                           and (j.locked_at is null or j.locked_at > now() - (? * interval '1 millisecond')))
      order by o.id limit ?`,
    [staleMs, limit],
  );
  return rows.map((r: { id: string; run_at: Date }) => ({ id: String(r.id), runAt: new Date(r.run_at) }));
}

export async function getOutboxRow(q: Knex, id: string): Promise<OutboxRow | undefined> {
  const row = await q('outbox').where({ id }).first();
  return row && fromDb(row);
}

export async function getNoticeOutbox(q: Knex, noticeId: string, lock = false): Promise<OutboxRow | undefined> {
  const b = q('outbox').where({ notice_id: noticeId, kind: 'notice' });
  const row = await (lock ? b.forUpdate() : b).first();
  return row && fromDb(row);
}

export async function getOutboxByIdempotencyKey(q: Knex, key: string): Promise<OutboxRow | undefined> {
  const row = await q('outbox').where({ idempotency_key: key }).first();
  return row && fromDb(row);
}

/**
 * Claims up to `limit` due rows for one worker: FOR UPDATE SKIP LOCKED inside the CTE means two
 * workers never pick the same row at the same moment, and the lease keeps it theirs after the
 * statement commits. An expired lease (a worker died) makes the row claimable again.
 * The attempt is counted at claim time, so a worker that keeps crashing still runs out of tries.
 */
export async function claimDue(q: Knex, p: { workerId: string; limit: number; leaseMs: number; onlyCaseIds?: string[]; onlyIds?: string[] }): Promise<OutboxRow[]> {
  const scopes: string[] = [];
  const scopeBindings: Knex.RawBinding[] = [];
  if (p.onlyCaseIds) scopes.push('and case_id = any(?::uuid[])'), scopeBindings.push(p.onlyCaseIds);
  if (p.onlyIds) scopes.push('and id = any(?::bigint[])'), scopeBindings.push(p.onlyIds);
  const scope = scopes.join(' ');
  const bindings: Knex.RawBinding[] = [...scopeBindings, p.limit, p.leaseMs, p.workerId];
  const { rows } = await q.raw(
    `with due as (
       select id from outbox
        where status = 'pending' and next_attempt_at <= now()
          and (lease_until is null or lease_until < now()) ${scope}
        order by next_attempt_at, id
        limit ?
        for update skip locked
     )
     update outbox o
        set lease_until = now() + (? * interval '1 millisecond'), leased_by = ?,
            attempts = o.attempts + 1, last_attempt_at = now()
       from due where o.id = due.id
     returning o.*`,
    bindings,
  );
  return (rows as Record<string, unknown>[]).map(fromDb).sort((a, b) => Number(a.id) - Number(b.id));
}

/** The very next statement after the SMTP server accepted: nothing else runs in between. */
export async function markSent(q: Knex, id: string, workerId: string): Promise<void> {
  await q.raw(
    `update outbox set status = 'sent', sent_at = now(), lease_until = null, last_error = null, effects_applied = (kind <> 'notice')
      where id = ? and leased_by = ? and status = 'pending'`,
    [id, workerId],
  );
}

/** A failed try: back to pending with a later next attempt, or failed for good after the last try. */
export async function markFailed(q: Knex, id: string, p: { workerId: string; error: string; delayMs: number; maxAttempts: number }): Promise<'pending' | 'failed' | 'lost-lease'> {
  const { rows } = await q.raw(
    `update outbox
        set status = case when attempts >= ? then 'failed' else 'pending' end,
            next_attempt_at = now() + (? * interval '1 millisecond'),
            lease_until = null, last_error = ?
      where id = ? and leased_by = ? and status = 'pending'
      returning status`,
    [p.maxAttempts, p.delayMs, p.error.slice(0, 500), id, p.workerId],
  );
  return rows[0]?.status ?? 'lost-lease';
}

/** Sent rows whose notice and case have not been updated yet (a crash in between, or just now). */
export async function sentWithoutEffects(q: Knex, limit = 50, minAgeMs = 0): Promise<OutboxRow[]> {
  const rows = await q('outbox')
    .where({ status: 'sent', effects_applied: false })
    .andWhereRaw("sent_at <= now() - (? * interval '1 millisecond')", [minAgeMs])
    .orderBy('id')
    .limit(limit);
  return rows.map(fromDb);
}

export async function lockOutboxRow(trx: Knex.Transaction, id: string): Promise<OutboxRow | undefined> {
  const row = await trx('outbox').where({ id }).forUpdate().first();
  return row && fromDb(row);
}

export async function markEffectsApplied(trx: Knex, id: string): Promise<void> {
  await trx('outbox').where({ id }).update({ effects_applied: true });
}

/** A coordinator's retry of a failed row: fresh tries, due now, same Message-ID. */
export async function requeue(trx: Knex, id: string): Promise<void> {
  await trx('outbox').where({ id }).update({ status: 'pending', attempts: 0, next_attempt_at: trx.fn.now(), lease_until: null, leased_by: null });
  await scheduleDelivery(trx, id);
}

/** Whether a drain should keep waiting: rows due now, or held by a lease (maybe of a dead worker). */
export async function pendingNowOrLeased(q: Knex): Promise<number> {
  const [{ n }] = await q('outbox')
    .where('status', 'pending')
    .andWhere((w) => w.where('next_attempt_at', '<=', q.fn.now()).orWhereNotNull('lease_until'))
    .count<{ n: string }[]>({ n: '*' });
  return Number(n);
}
