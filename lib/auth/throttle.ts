import { db } from '@/db';

/**
 * Slows and then refuses repeated failed sign-ins, per e-mail address and per client.
 * Counts live in PostgreSQL so they survive a restart and hold across processes.
 */
export const THROTTLE = {
  windowMinutes: 15,
  maxPerEmail: 8,
  maxPerClient: 30,
  /** failures before answers start to slow down */
  freeFailures: 2,
  stepMs: 300,
  maxDelayMs: 2500,
} as const;

const emailKey = (email: string) => `email:${email.trim().toLowerCase()}`;
const clientKey = (client: string) => `client:${client}`;

async function failuresFor(key: string): Promise<number> {
  const row = await db('sign_in_failures')
    .where({ key })
    .andWhere('window_started_at', '>', db.raw(`now() - interval '${THROTTLE.windowMinutes} minutes'`))
    .first('failures');
  return row ? Number(row.failures) : 0;
}

/** Whether this attempt must be refused outright, and if so for roughly how long. */
export async function signInBlocked(email: string, client: string): Promise<{ blocked: boolean; retryAfterS: number }> {
  const [byEmail, byClient] = await Promise.all([failuresFor(emailKey(email)), failuresFor(clientKey(client))]);
  const blocked = byEmail >= THROTTLE.maxPerEmail || byClient >= THROTTLE.maxPerClient;
  return { blocked, retryAfterS: blocked ? THROTTLE.windowMinutes * 60 : 0 };
}

/** Records one failure for both keys; returns how long to hold the answer back. */
export async function recordFailure(email: string, client: string): Promise<number> {
  let worst = 0;
  for (const key of [emailKey(email), clientKey(client)]) {
    const { rows } = await db.raw<{ rows: { failures: number }[] }>(
      `insert into sign_in_failures (key, failures, window_started_at) values (?, 1, now())
       on conflict (key) do update set
         failures = case when sign_in_failures.window_started_at < now() - interval '${THROTTLE.windowMinutes} minutes'
                         then 1 else sign_in_failures.failures + 1 end,
         window_started_at = case when sign_in_failures.window_started_at < now() - interval '${THROTTLE.windowMinutes} minutes'
                         then now() else sign_in_failures.window_started_at end
       returning failures`,
      [key],
    );
    worst = Math.max(worst, rows[0].failures);
  }
  return Math.min(THROTTLE.maxDelayMs, Math.max(0, worst - THROTTLE.freeFailures) * THROTTLE.stepMs);
}

export async function clearFailures(email: string): Promise<void> {
  await db('sign_in_failures').where({ key: emailKey(email) }).delete();
}

/** The client's address as the server saw it (Next.js fills x-forwarded-for from the socket). */
export function clientOf(headers: Headers | Record<string, string | string[] | undefined>): string {
  const raw = headers instanceof Headers ? headers.get('x-forwarded-for') : headers['x-forwarded-for'];
  const first = (Array.isArray(raw) ? raw[0] : raw)?.split(',')[0]?.trim();
  return first || 'unknown';
}
