import type { Knex } from 'knex';
import { db } from './index';

/**
 * Counters for sign-in and password-reset limits (table auth_limits), one row per key
 * ("signin-email:…", "signin-client:…", "reset-email:…", …), each in a fixed window.
 * Kept in PostgreSQL so every app instance sees the same counts.
 */
export type LimitHit = { key: string; hits: number; retryAfterS: number };

/**
 * Counts one attempt for every key in one statement and returns the new counts. Each row is
 * incremented atomically (INSERT … ON CONFLICT DO UPDATE takes the row lock), so n parallel
 * attempts see the counts 1..n: a burst cannot slip past a limit by racing a read.
 * A window older than `windowMinutes` starts again at 1.
 */
export async function hitLimits(keys: string[], windowMinutes: number, q: Knex = db): Promise<LimitHit[]> {
  const rows = keys.map(() => '(?, 1, now())').join(', ');
  const { rows: out } = await q.raw<{ rows: { key: string; hits: number; retry_after_s: number }[] }>(
    `insert into auth_limits as l (key, hits, window_started_at) values ${rows}
     on conflict (key) do update set
       hits = case when l.window_started_at < now() - (? * interval '1 minute') then 1 else l.hits + 1 end,
       window_started_at = case when l.window_started_at < now() - (? * interval '1 minute') then now() else l.window_started_at end
     returning key, hits,
       greatest(1, ceil(extract(epoch from (window_started_at + (? * interval '1 minute') - now()))))::int as retry_after_s`,
    [...keys, windowMinutes, windowMinutes, windowMinutes],
  );
  return keys.map((k) => {
    const r = out.find((o) => o.key === k)!;
    return { key: k, hits: Number(r.hits), retryAfterS: Number(r.retry_after_s) };
  });
}

/** Takes one attempt back (a success that should not count against a shared client). */
export async function refundHit(key: string, q: Knex = db): Promise<void> {
  await q('auth_limits').where({ key }).andWhere('hits', '>', 0).decrement('hits', 1);
}

/** Forgets a key's counter: a successful sign-in or password reset lifts the account's lock. */
export async function clearLimit(key: string, q: Knex = db): Promise<void> {
  await q('auth_limits').where({ key }).delete();
}

/** The current count of a key within its window (0 when none or expired). */
export async function currentHits(key: string, windowMinutes: number, q: Knex = db): Promise<number> {
  const row = await q('auth_limits')
    .where({ key })
    .andWhere('window_started_at', '>', q.raw(`now() - (? * interval '1 minute')`, [windowMinutes]))
    .first('hits');
  return row ? Number(row.hits) : 0;
}
