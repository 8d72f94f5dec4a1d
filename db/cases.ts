import type { Knex } from 'knex';
import { db } from './index';
import type { CaseEvent, CaseRow, Role } from './types';
import type { CaseRight } from '@/lib/hunt/access';
import { whereCaseRight } from './case-scope';

const CASE_COLUMNS = {
  id: 'c.id',
  reference: 'c.reference',
  title: 'c.title',
  description: 'c.description',
  status: 'c.status',
  reporterId: 'c.reporter_id',
  assigneeId: 'c.assignee_id',
  reportedLat: 'c.reported_lat',
  reportedLon: 'c.reported_lon',
  bands: 'c.bands',
  version: 'c.version',
  createdAt: 'c.created_at',
  updatedAt: 'c.updated_at',
  report: 'c.report',
  consentShareName: 'c.consent_share_name',
  possibleDuplicateOf: 'c.possible_duplicate_of',
  mergedInto: 'c.merged_into',
  outcome: 'c.outcome',
  levelBeforeDbm: 'c.level_before_dbm',
  levelAfterDbm: 'c.level_after_dbm',
  resolvedAt: 'c.resolved_at',
} as const;

type Viewer = { id: string; role: Role };

export async function getCase(id: string, q: Knex = db): Promise<CaseRow | undefined> {
  return q('cases as c').select(CASE_COLUMNS).where('c.id', id).first();
}

/** The case row locked for the rest of the transaction (serialises writers on one case). For the worker; requests use lockVisibleCase. */
export async function lockCase(trx: Knex.Transaction, id: string): Promise<CaseRow | undefined> {
  return trx('cases as c').select(CASE_COLUMNS).where('c.id', id).forUpdate().first();
}

/** The case if `viewer` has `right` on it (the access rule as a query), else undefined. */
export async function getCaseWithRight(q: Knex, viewer: Viewer, id: string, right: CaseRight = 'view'): Promise<CaseRow | undefined> {
  return whereCaseRight(q('cases as c').select(CASE_COLUMNS).where('c.id', id), viewer, right).first();
}

/** The same, locked for the rest of the transaction: who may see it is decided on the locked row. */
export async function lockCaseWithRight(trx: Knex.Transaction, viewer: Viewer, id: string, right: CaseRight = 'view'): Promise<CaseRow | undefined> {
  return whereCaseRight(trx('cases as c').select(CASE_COLUMNS).where('c.id', id), viewer, right).forUpdate().first();
}

/** Name, call sign and e-mail of the people a case names (assignee, reporter). */
export async function casePeople(q: Knex, ids: (string | null)[]): Promise<{ id: string; name: string; callSign: string | null; email: string }[]> {
  const wanted = ids.filter((x): x is string => !!x);
  if (wanted.length === 0) return [];
  return q('users').select({ id: 'id', name: 'name', callSign: 'call_sign', email: 'email' }).whereIn('id', wanted);
}

/** Reference and title of the cases a case points at (merged into, possible duplicate of). */
export async function caseRefs(q: Knex, ids: (string | null)[]): Promise<{ id: string; reference: string; title: string }[]> {
  const wanted = ids.filter((x): x is string => !!x);
  if (wanted.length === 0) return [];
  return q('cases').select('id', 'reference', 'title').whereIn('id', wanted);
}

/** The newest comment in which someone confirmed the premises, if any. */
export async function latestPremisesConfirmation(q: Knex, caseId: string): Promise<{ id: string; actorId: string | null } | undefined> {
  const row = await q('case_events')
    .where({ case_id: caseId, kind: 'comment' })
    .whereRaw("(data->>'premisesConfirmed')::boolean is true")
    .orderBy('id', 'desc')
    .first('id', 'actor_id');
  return row && { id: String(row.id), actorId: row.actor_id };
}

/** Who last changed a case and how, for a plain 409 message. */
export async function lastChange(caseId: string, q: Knex = db): Promise<{ actorName: string | null; kind: string; createdAt: Date } | undefined> {
  return q('case_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .select({ actorName: 'u.name', kind: 'e.kind', createdAt: 'e.created_at' })
    .where('e.case_id', caseId)
    .orderBy('e.id', 'desc')
    .first();
}

const CASE_WRITABLE = {
  title: 'title',
  description: 'description',
  status: 'status',
  assigneeId: 'assignee_id',
  bands: 'bands',
  mergedInto: 'merged_into',
  possibleDuplicateOf: 'possible_duplicate_of',
  outcome: 'outcome',
  levelBeforeDbm: 'level_before_dbm',
  levelAfterDbm: 'level_after_dbm',
} as const;
export type CaseChanges = Partial<{ [K in keyof typeof CASE_WRITABLE]: CaseRow[K] }> & { resolvedAt?: Date | null };

/** Writes changes and bumps the version; the caller has locked the row and checked the version. */
export async function writeCase(trx: Knex.Transaction, id: string, changes: CaseChanges): Promise<void> {
  const cols: Record<string, unknown> = { version: trx.raw('version + 1'), updated_at: trx.fn.now() };
  for (const [k, col] of Object.entries(CASE_WRITABLE)) {
    const v = changes[k as keyof CaseChanges];
    if (v !== undefined) cols[col] = v;
  }
  if (changes.resolvedAt !== undefined) cols.resolved_at = changes.resolvedAt;
  await trx('cases').where({ id }).update(cols);
}

/** An open case within `radiusM` metres of a point that shares a band (excluding one case). */
export async function findNearbyOpenCase(
  q: Knex,
  p: { lat: number; lon: number; bands: string[]; radiusM: number; excludeId?: string },
): Promise<{ id: string; reference: string; title: string } | undefined> {
  if (p.bands.length === 0) return undefined;
  // Geodesic distance on the WGS84 ellipsoid (PostGIS geography), through the GiST index on reported_geog.
  return q('cases')
    .select('id', 'reference', 'title')
    .where('status', 'open')
    .whereNull('merged_into')
    .whereNotNull('reported_geog')
    .whereRaw('bands && ?::text[]', [p.bands])
    .modify((b) => (p.excludeId ? b.whereNot('id', p.excludeId) : b))
    .whereRaw('ST_DWithin(reported_geog, geography(ST_SetSRID(ST_MakePoint(?, ?), 4326)), ?)', [p.lon, p.lat, p.radiusM])
    .orderBy('created_at', 'asc')
    .first();
}

/** Our reference format: QF-<year>-<4-digit sequence>, e.g. QF-2026-0007. */
export async function nextCaseReference(trx: Knex, now = new Date()): Promise<string> {
  const { rows } = await trx.raw<{ rows: { n: string }[] }>("select nextval('case_reference_seq') as n");
  return `QF-${now.getUTCFullYear()}-${String(rows[0].n).padStart(4, '0')}`;
}

export async function insertCase(
  trx: Knex,
  c: Pick<CaseRow, 'title' | 'description' | 'reporterId' | 'reportedLat' | 'reportedLon' | 'bands'> &
    Partial<Pick<CaseRow, 'status' | 'assigneeId' | 'report' | 'consentShareName' | 'possibleDuplicateOf' | 'outcome'>>,
): Promise<CaseRow> {
  const reference = await nextCaseReference(trx);
  const [{ id }] = await trx('cases')
    .insert({
      reference,
      title: c.title,
      description: c.description,
      status: c.status ?? 'open',
      reporter_id: c.reporterId,
      assignee_id: c.assigneeId ?? null,
      reported_lat: c.reportedLat,
      reported_lon: c.reportedLon,
      bands: c.bands,
      report: JSON.stringify(c.report ?? {}),
      consent_share_name: c.consentShareName ?? false,
      possible_duplicate_of: c.possibleDuplicateOf ?? null,
      outcome: c.outcome ?? null,
    })
    .returning('id');
  return (await getCase(id, trx))!;
}

/**
 * Appends to the case timeline. visibility 'all' lets the reporter read it too;
 * 'committee' (the default) keeps it to coordinators, admins and the assigned hunter.
 */
export async function appendEvent(
  trx: Knex,
  e: { caseId: string; actorId: string | null; kind: string; data?: Record<string, unknown>; visibility?: 'all' | 'committee' },
): Promise<CaseEvent> {
  const [row] = await trx('case_events')
    .insert({ case_id: e.caseId, actor_id: e.actorId, kind: e.kind, data: JSON.stringify(e.data ?? {}), visibility: e.visibility ?? 'committee' })
    .returning(['id', 'created_at']);
  return {
    id: String(row.id),
    caseId: e.caseId,
    actorId: e.actorId,
    kind: e.kind,
    data: e.data ?? {},
    visibility: e.visibility ?? 'committee',
    createdAt: row.created_at,
  };
}

export async function listEvents(caseId: string, opts: { includeCommittee: boolean }): Promise<(CaseEvent & { actorName: string | null })[]> {
  return db('case_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .select({
      id: 'e.id',
      caseId: 'e.case_id',
      actorId: 'e.actor_id',
      actorName: 'u.name',
      kind: 'e.kind',
      data: 'e.data',
      visibility: 'e.visibility',
      createdAt: 'e.created_at',
    })
    .where('e.case_id', caseId)
    .modify((b) => (opts.includeCommittee ? b : b.where('e.visibility', 'all')))
    .orderBy([{ column: 'e.created_at' }, { column: 'e.id' }]);
}
