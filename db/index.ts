import knex, { type Knex } from 'knex';
import { env } from '@/lib/env';
import { knexConfig } from './config';

declare global {
  // Reused across hot reloads in development so there is only ever one pool.
  var __quietfixDb: Knex | undefined;
}

/** The one knex instance of the app. */
export const db: Knex = globalThis.__quietfixDb ?? knex(knexConfig(env));
if (env.NODE_ENV !== 'production') globalThis.__quietfixDb = db;

/** Whether PostgreSQL answers at all (the health check). */
export async function pingDatabase(q: Knex = db): Promise<void> {
  await q.raw('select 1');
}

/** Run `work` in one transaction; everything or nothing is written. */
export function inTransaction<T>(work: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  return db.transaction(work);
}
