import type { Knex } from 'knex';
import { db } from './index';

/** Names in data_revisions (migrations/20261202130000_data_revisions.ts). */
export type DataName = 'cases';

/** The query for a revision: built, not run, so the bench's minimal server runs exactly this SQL. */
export function revisionQuery(name: DataName, q: Knex = db): Knex.QueryBuilder {
  return q('data_revisions').select('rev').where({ name });
}

/**
 * The committed revision of `name` (the case rows and assignee names behind the queue and the map):
 * it grows by one with every transaction that writes them. Text, since bigint outgrows a JS number.
 */
export async function dataRevision(name: DataName, q: Knex = db): Promise<string> {
  const [row] = await revisionQuery(name, q);
  return String(row?.rev ?? '0');
}

/** The same revision as a column of another query (one round trip: lib/auth/session.ts reads it with the user). */
export function revisionColumn(name: DataName, alias: string, q: Knex = db): Knex.Raw {
  return q.raw('(?)::text as ??', [revisionQuery(name, q), alias]);
}
