import type { Knex } from 'knex';
import { lastChange } from '@/db/cases';
import { AppError, conflict } from '@/lib/errors';

/** 409 for a stale version, saying who changed what and when. */
export async function staleError(q: Knex, caseId: string, currentVersion: number): Promise<AppError> {
  const last = await lastChange(caseId, q);
  const who = last?.actorName ?? 'someone';
  const what = last ? last.kind.replace(/-/g, ' ') : 'a change';
  const when = last ? new Date(last.createdAt).toISOString().slice(11, 16) + ' UTC' : 'recently';
  return conflict(`${who} changed this case (${what}, ${when}) after you loaded it. Reload to see the change, then try again.`, {
    currentVersion,
    changedBy: last?.actorName ?? null,
    change: last?.kind ?? null,
  });
}

/** Throws the 409 unless the caller's version is the current one. */
export async function assertVersion(q: Knex, row: { id: string; version: number }, version: number): Promise<void> {
  if (row.version !== version) throw await staleError(q, row.id, row.version);
}
