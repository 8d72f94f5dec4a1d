import type { Knex } from 'knex';
import { db } from './index';
import type { BearingRow } from './types';

const COLUMNS = {
  id: 'b.id',
  caseId: 'b.case_id',
  authorId: 'b.author_id',
  lat: 'b.lat',
  lon: 'b.lon',
  positionSource: 'b.position_source',
  positionAccuracyM: 'b.position_accuracy_m',
  azimuthEnteredDeg: 'b.azimuth_entered_deg',
  reference: 'b.reference',
  declinationDeg: 'b.declination_deg',
  azimuthTrueDeg: 'b.azimuth_true_deg',
  sigmaDeg: 'b.sigma_deg',
  nullWidthDeg: 'b.null_width_deg',
  frequencyKhz: 'b.frequency_khz',
  oneWay: 'b.one_way',
  note: 'b.note',
  sweep: 'b.sweep',
  excluded: 'b.excluded',
  version: 'b.version',
  clientId: 'b.client_id',
  takenAt: 'b.taken_at',
  createdAt: 'b.created_at',
  updatedAt: 'b.updated_at',
} as const;

/** The columns a bearing write may set (camelCase -> snake_case). */
const WRITABLE = {
  lat: 'lat',
  lon: 'lon',
  positionSource: 'position_source',
  positionAccuracyM: 'position_accuracy_m',
  azimuthEnteredDeg: 'azimuth_entered_deg',
  reference: 'reference',
  declinationDeg: 'declination_deg',
  azimuthTrueDeg: 'azimuth_true_deg',
  sigmaDeg: 'sigma_deg',
  nullWidthDeg: 'null_width_deg',
  frequencyKhz: 'frequency_khz',
  oneWay: 'one_way',
  note: 'note',
  excluded: 'excluded',
  takenAt: 'taken_at',
  clientId: 'client_id',
} as const;
export type BearingFields = Partial<Pick<BearingRow, keyof typeof WRITABLE>> & { sweep?: unknown };

function toColumns(f: BearingFields): Record<string, unknown> {
  const cols: Record<string, unknown> = {};
  for (const [k, col] of Object.entries(WRITABLE)) {
    const v = f[k as keyof typeof WRITABLE];
    if (v !== undefined) cols[col] = v;
  }
  if (f.sweep !== undefined) cols.sweep = f.sweep === null ? null : JSON.stringify(f.sweep);
  return cols;
}

export type BearingWithAuthor = BearingRow & { authorName: string | null; authorCallSign: string | null; revisions: number };

function withAuthor(q: Knex) {
  return q('bearings as b')
    .leftJoin('users as u', 'u.id', 'b.author_id')
    .select({
      ...COLUMNS,
      authorName: 'u.name',
      authorCallSign: 'u.call_sign',
      revisions: q.raw('(select count(*)::int from bearing_revisions r where r.bearing_id = b.id)'),
    });
}

export async function listBearings(caseId: string, q: Knex = db): Promise<BearingWithAuthor[]> {
  return withAuthor(q).where('b.case_id', caseId).orderBy([{ column: 'b.taken_at' }, { column: 'b.created_at' }]);
}

export async function getBearing(caseId: string, id: string, q: Knex = db): Promise<BearingWithAuthor | undefined> {
  return withAuthor(q).where({ 'b.case_id': caseId, 'b.id': id }).first();
}

/** The bearing a phone already sent under this client id, in any case (client ids are unique). */
export async function findBearingByClientId(clientId: string, q: Knex = db): Promise<Pick<BearingRow, 'id' | 'caseId' | 'authorId' | 'sweep'> | undefined> {
  return q('bearings').select({ id: 'id', caseId: 'case_id', authorId: 'author_id', sweep: 'sweep' }).where({ client_id: clientId }).first();
}

export async function insertBearing(trx: Knex.Transaction, caseId: string, authorId: string, f: BearingFields): Promise<string> {
  const [row] = await trx('bearings')
    .insert({ case_id: caseId, author_id: authorId, ...toColumns(f) })
    .returning('id');
  return row.id;
}

/** Keeps the previous state as a revision, then writes the change and bumps the version. */
export async function reviseBearing(trx: Knex.Transaction, before: BearingRow, editorId: string, f: BearingFields): Promise<void> {
  await trx('bearing_revisions').insert({ bearing_id: before.id, editor_id: editorId, version: before.version, before: JSON.stringify(before) });
  await trx('bearings')
    .where({ id: before.id })
    .update({ ...toColumns(f), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
}

/** Moves every bearing of one case to another (merge); their history goes with them. */
export async function moveBearings(trx: Knex.Transaction, fromCaseId: string, toCaseId: string): Promise<number> {
  return trx('bearings').where({ case_id: fromCaseId }).update({ case_id: toCaseId, updated_at: trx.fn.now() });
}
