import type { Knex } from 'knex';
import { moveBearings } from '@/db/bearings';
import { appendEvent, writeCase } from '@/db/cases';
import type { CaseRow, User } from '@/db/types';
import { badRequest } from '@/lib/errors';
import { lockVisibleCase } from './case-detail';
import { recomputeFix } from './fix';
import { assertVersion } from './stale';
import { ruleNotMet } from './transitions';

/**
 * Merges a duplicate into the older case: its bearings and bands move over, it is resolved as a
 * duplicate pointing at the older case, and both timelines record it. Both rows are locked in id
 * order so two merges cannot deadlock.
 */
export async function mergeInto(trx: Knex.Transaction, user: User, dupId: string, targetId: string, version: number): Promise<CaseRow> {
  if (dupId === targetId) throw badRequest('A case cannot be merged into itself.');
  const [first, second] = [dupId, targetId].sort();
  const a = (await lockVisibleCase(trx, user, first)).row;
  const b = (await lockVisibleCase(trx, user, second)).row;
  const [dup, target] = a.id === dupId ? [a, b] : [b, a];
  await assertVersion(trx, dup, version);
  if (dup.mergedInto) throw ruleNotMet('This case has already been merged.');
  if (target.mergedInto || target.status === 'resolved') throw ruleNotMet(`${target.reference} is closed; reopen it or pick another case.`);
  if (new Date(target.createdAt) > new Date(dup.createdAt)) throw ruleNotMet(`Merge the newer case into the older one: ${target.reference} is newer than ${dup.reference}.`);

  const moved = await moveBearings(trx, dup.id, target.id);
  await writeCase(trx, target.id, { bands: [...new Set([...target.bands, ...dup.bands])] });
  await writeCase(trx, dup.id, { status: 'resolved', outcome: 'duplicate', mergedInto: target.id, resolvedAt: new Date() });
  await appendEvent(trx, {
    caseId: target.id,
    actorId: user.id,
    kind: 'merged-in',
    data: { fromCaseId: dup.id, fromReference: dup.reference, bearingsMoved: moved, bandsAdded: dup.bands.filter((b) => !target.bands.includes(b)) },
  });
  await appendEvent(trx, {
    caseId: dup.id,
    actorId: user.id,
    kind: 'merged-into',
    data: { intoCaseId: target.id, intoReference: target.reference, bearingsMoved: moved },
    visibility: 'all',
  });
  if (moved > 0) {
    await recomputeFix(trx, target.id, `merged-in ${dup.reference}`);
    await recomputeFix(trx, dup.id, `merged-into ${target.reference}`);
  }
  return (await lockVisibleCase(trx, user, target.id)).row;
}
