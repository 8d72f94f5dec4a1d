import type { Knex } from 'knex';
import { db } from './index';
import type { CaseEvent, CaseRow, CaseStatus, Role } from './types';
import type { Page, Paging } from '@/lib/api/paging';

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
} as const;

export type CaseListItem = Pick<CaseRow, 'id' | 'reference' | 'title' | 'status' | 'bands' | 'createdAt' | 'updatedAt'> & {
  assigneeName: string | null;
};

export type CaseFilter = { status?: CaseStatus; assigneeId?: string; band?: string; q?: string };

/**
 * Cases the viewer may see: coordinators and admins all, hunters those assigned to them,
 * members their own reports. The reporter's position is never part of a list row.
 */
export async function listCasesFor(viewer: { id: string; role: Role }, filter: CaseFilter, paging: Paging): Promise<Page<CaseListItem>> {
  const base = db('cases as c').leftJoin('users as a', 'a.id', 'c.assignee_id');
  if (viewer.role === 'hunter') base.where('c.assignee_id', viewer.id);
  if (viewer.role === 'member') base.where('c.reporter_id', viewer.id);
  if (filter.status) base.where('c.status', filter.status);
  if (filter.assigneeId) base.where('c.assignee_id', filter.assigneeId);
  if (filter.band) base.whereRaw('? = any(c.bands)', [filter.band]);
  if (filter.q) {
    const like = `%${filter.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`;
    base.where((w) => w.whereILike('c.title', like).orWhereILike('c.reference', like).orWhereILike('c.description', like));
  }
  const [{ count }] = await base.clone().count<{ count: string }[]>({ count: 'c.id' });
  const items = await base
    .select({
      id: CASE_COLUMNS.id,
      reference: CASE_COLUMNS.reference,
      title: CASE_COLUMNS.title,
      status: CASE_COLUMNS.status,
      bands: CASE_COLUMNS.bands,
      createdAt: CASE_COLUMNS.createdAt,
      updatedAt: CASE_COLUMNS.updatedAt,
      assigneeName: 'a.name',
    })
    .orderBy('c.updated_at', 'desc')
    .limit(paging.pageSize)
    .offset((paging.page - 1) * paging.pageSize);
  return { items, total: Number(count), ...paging };
}

export async function getCase(id: string, q: Knex = db): Promise<CaseRow | undefined> {
  return q('cases as c').select(CASE_COLUMNS).where('c.id', id).first();
}

/** Our reference format: QF-<year>-<4-digit sequence>, e.g. QF-2026-0007. */
export async function nextCaseReference(trx: Knex, now = new Date()): Promise<string> {
  const { rows } = await trx.raw<{ rows: { n: string }[] }>("select nextval('case_reference_seq') as n");
  return `QF-${now.getUTCFullYear()}-${String(rows[0].n).padStart(4, '0')}`;
}

export async function insertCase(
  trx: Knex,
  c: Pick<CaseRow, 'title' | 'description' | 'reporterId' | 'reportedLat' | 'reportedLon' | 'bands'> & Partial<Pick<CaseRow, 'status' | 'assigneeId'>>,
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
    })
    .returning('id');
  return (await getCase(id, trx))!;
}

export async function appendEvent(trx: Knex, e: { caseId: string; actorId: string | null; kind: string; data?: Record<string, unknown> }): Promise<void> {
  await trx('case_events').insert({ case_id: e.caseId, actor_id: e.actorId, kind: e.kind, data: JSON.stringify(e.data ?? {}) });
}

export async function listEvents(caseId: string): Promise<(CaseEvent & { actorName: string | null })[]> {
  return db('case_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .select({ id: 'e.id', caseId: 'e.case_id', actorId: 'e.actor_id', actorName: 'u.name', kind: 'e.kind', data: 'e.data', createdAt: 'e.created_at' })
    .where('e.case_id', caseId)
    .orderBy([{ column: 'e.created_at' }, { column: 'e.id' }]);
}
