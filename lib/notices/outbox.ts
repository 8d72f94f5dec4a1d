import type { Knex } from 'knex';
import type { Transporter } from 'nodemailer';
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import { db } from '@/db';
import { appendEvent, lockCase, writeCase } from '@/db/cases';
import { getNotice, lockNotice, writeNotice } from '@/db/notices';
import { claimDue, getOutboxRow, lockOutboxRow, markEffectsApplied, markFailed, markSent, sentWithoutEffects, type OutboxRow } from '@/db/outbox';
import { mailer } from '@/lib/mail/send';
import { composeAccountMail, RetiredLinkError } from '@/lib/auth/account-mail';
import { env } from '@/lib/env';
import { backoffMs } from './backoff';
import { renderFrozen } from './values';
import { prepareReminders } from './reminders';

/**
 * The outbox worker's core, shared by scripts/outbox-worker.ts and the tests.
 * Delivery is at-least-once with one small, documented window (see lib/notices/README.md):
 * claim with a lease -> SMTP -> mark 'sent' in the very next statement -> apply the effects
 * (notice sent, case notified, timeline) in their own transaction, re-applied after a crash.
 */
export type MailTransport = Pick<Transporter, 'sendMail'>;

export type WorkerOptions = {
  /** a knex instance (tests use their own pools to act as separate workers) */
  knex?: Knex;
  transport?: MailTransport;
  workerId?: string;
  batchSize?: number;
  leaseMs?: number;
  backoffBaseMs?: number;
  backoffCapMs?: number;
  maxAttempts?: number;
  /** only rows of these cases (tests that need a worker of their own) */
  onlyCaseIds?: string[];
  /** only these outbox rows (tests of account mail, which belongs to no case) */
  onlyIds?: string[];
  /** skip preparing reminders in this run */
  skipReminders?: boolean;
};

export const newWorkerId = () => `${hostname()}:${process.pid}:${randomBytes(4).toString('hex')}`;

function settings(o: WorkerOptions) {
  const c = env;
  return {
    q: o.knex ?? db,
    transport: o.transport ?? mailer(),
    workerId: o.workerId ?? newWorkerId(),
    batchSize: o.batchSize ?? c.OUTBOX_BATCH_SIZE,
    leaseMs: o.leaseMs ?? c.OUTBOX_LEASE_MS,
    backoffBaseMs: o.backoffBaseMs ?? c.OUTBOX_BACKOFF_BASE_MS,
    backoffCapMs: o.backoffCapMs ?? c.OUTBOX_BACKOFF_CAP_MS,
    maxAttempts: o.maxAttempts ?? c.OUTBOX_MAX_ATTEMPTS,
  };
}


/** Claims due rows for this worker (lease + FOR UPDATE SKIP LOCKED). */
export async function claimBatch(o: WorkerOptions & { workerId: string }): Promise<OutboxRow[]> {
  const s = settings(o);
  return claimDue(s.q, { workerId: o.workerId, limit: s.batchSize, leaseMs: s.leaseMs, onlyCaseIds: o.onlyCaseIds, onlyIds: o.onlyIds });
}

async function composeMessage(q: Knex, row: OutboxRow) {
  const base = { to: row.toAddress, messageId: row.messageId, from: env.MAIL_FROM };
  if (row.kind === 'alert') return { ...base, subject: row.subject ?? '', text: row.textBody ?? '', html: row.htmlBody ?? undefined };
  if (row.kind === 'account') return { ...base, ...(await composeAccountMail(q, row)) };
  const n = await getNotice(row.noticeId!, q);
  if (!n?.frozen) throw new Error('the notice is missing or was never approved');
  const m = renderFrozen({ ...n, frozen: n.frozen });
  return { ...base, subject: m.subject, text: m.text, html: m.fullHtml, replyTo: n.frozen.values.clubContactEmail || undefined };
}

/**
 * After the server accepted a notice: the notice becomes sent and, for the first one, the case
 * moves located -> notified with its timeline entry, in one transaction. Locks in the same order
 * as the request handlers (case, notice, outbox row). Runs again safely (effects_applied).
 */
export async function applySentEffects(q: Knex, outboxId: string): Promise<void> {
  const peek = await getOutboxRow(q, outboxId);
  if (!peek || peek.effectsApplied || peek.status !== 'sent') return;
  await q.transaction(async (trx) => {
    const c = peek.caseId ? await lockCase(trx, peek.caseId) : undefined;
    const n = peek.noticeId ? await lockNotice(trx, peek.noticeId) : undefined;
    const row = await lockOutboxRow(trx, outboxId);
    if (!row || row.effectsApplied || row.status !== 'sent') return;
    if (row.kind === 'notice' && n && c) {
      if (n.status === 'queued' || n.status === 'failed') await writeNotice(trx, n.id, { status: 'sent', sentAt: row.sentAt });
      const moves = c.status === 'located';
      // The worker is not a user: no version check, but the case row is locked like any writer.
      if (moves) await writeCase(trx, c.id, { status: 'notified' });
      await appendEvent(trx, {
        caseId: c.id,
        actorId: null,
        kind: 'notice-sent',
        data: { noticeId: n.id, template: n.templateKey, via: 'e-mail', ...(moves ? { from: 'located', to: 'notified' } : {}) },
        visibility: 'all',
      });
    }
    await markEffectsApplied(trx, outboxId);
  });
}

/** Sends one claimed row. Returns what became of it. */
export async function deliverOne(row: OutboxRow, o: WorkerOptions & { workerId: string }): Promise<'sent' | 'pending' | 'failed' | 'lost-lease'> {
  const s = settings(o);
  let error: string;
  let permanent = false;
  try {
    const message = await composeMessage(s.q, row);
    await s.transport.sendMail(message);
    // The one window SMTP cannot close: a crash right here re-sends this row after its lease
    // (same Message-ID). Nothing runs between the server's OK and this statement.
    await markSent(s.q, row.id, o.workerId);
    try {
      await applySentEffects(s.q, row.id);
    } catch (err) {
      console.error(`[quietfix outbox] row ${row.id} sent; updating the notice failed (retried next run):`, (err as Error).message);
    }
    return 'sent';
  } catch (err) {
    error = (err as Error).message || String(err);
    // An account e-mail whose link was replaced or used meanwhile: no retry would help.
    permanent = err instanceof RetiredLinkError;
  }
  const result = await markFailed(s.q, row.id, {
    workerId: o.workerId,
    error,
    delayMs: backoffMs(row.attempts, s.backoffBaseMs, s.backoffCapMs),
    maxAttempts: permanent ? 0 : s.maxAttempts,
  });
  if (result === 'failed' && row.noticeId) {
    await s.q.transaction(async (trx) => {
      const n = await lockNotice(trx, row.noticeId!);
      if (n?.status === 'queued') await writeNotice(trx, n.id, { status: 'failed' });
    });
  }
  return result;
}

export type RunResult = { claimed: number; sent: number; retrying: number; failed: number; effects: number; reminders: number };

/** One pass: finish effects left by a crash, deliver one batch, prepare due reminders. */
export async function runWorkerOnce(o: WorkerOptions = {}): Promise<RunResult> {
  const s = settings(o);
  const opts = { ...o, workerId: s.workerId };
  const out: RunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0, effects: 0, reminders: 0 };
  for (const r of await sentWithoutEffects(s.q)) {
    await applySentEffects(s.q, r.id);
    out.effects++;
  }
  const batch = await claimBatch(opts);
  out.claimed = batch.length;
  for (const row of batch) {
    const r = await deliverOne(row, opts);
    if (r === 'sent') out.sent++;
    else if (r === 'pending') out.retrying++;
    else if (r === 'failed') out.failed++;
  }
  if (!o.skipReminders && !o.onlyCaseIds && !o.onlyIds) out.reminders = await prepareReminders(s.q);
  return out;
}
