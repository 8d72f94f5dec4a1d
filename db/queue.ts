import type { Knex } from 'knex';
import { db } from './index';
import { whereCaseRight } from './case-scope';
import type { CaseStatus, Role } from './types';
import { areaPolygon, type QueueFilter, type QueueQuery, type QueueSort } from '@/lib/validation/queue';
import { badRequest } from '@/lib/errors';

/** Counting stops here; the queue shows "10,000+". */
export const COUNT_CAP = 10_000;

type Viewer = { id: string; role: Role };

/** The SQL expression, its type (for the keyset cursor) and whether it needs the assignee join. */
const SORT_KEYS: Record<QueueSort, { expr: string; type: string; invert?: boolean }> = {
  reference: { expr: 'c.reference', type: 'text' },
  status: { expr: "array_position(array['open','located','notified','resolved']::text[], c.status)", type: 'int' },
  // Age in the current state grows as status_since goes back: "oldest first" is status_since ascending.
  stateAge: { expr: 'c.status_since', type: 'timestamptz', invert: true },
  band: { expr: "coalesce(c.bands[1], '')", type: 'text' },
  hunter: { expr: "coalesce(lower(a.name), '')", type: 'text' },
  lastActivity: { expr: 'c.last_activity_at', type: 'timestamptz' },
  fixSize: { expr: "coalesce(c.fix_size_m, 'Infinity'::float8)", type: 'float8' },
  notices: { expr: 'c.notice_count', type: 'int' },
};

export type QueueItem = {
  id: string;
  reference: string;
  title: string;
  status: CaseStatus;
  bands: string[];
  createdAt: Date;
  updatedAt: Date;
  statusSince: Date;
  lastActivityAt: Date;
  fixSizeM: number | null;
  noticeCount: number;
  assigneeId: string | null;
  assigneeName: string | null;
};

export type QueuePage = {
  items: QueueItem[];
  /** exact up to COUNT_CAP; with totalCapped true there are at least that many */
  total: number;
  totalCapped: boolean;
  page: number;
  pageSize: number;
  nextCursor: string | null;
  sort: QueueSort;
  dir: 'asc' | 'desc';
};

/** Columns a list row of cases carries (the query joins the assignee as `u`). */
export const LIST_COLUMNS = {
  id: 'c.id',
  reference: 'c.reference',
  title: 'c.title',
  status: 'c.status',
  bands: 'c.bands',
  createdAt: 'c.created_at',
  lastActivityAt: 'c.last_activity_at',
  fixSizeM: 'c.fix_size_m',
  noticeCount: 'c.notice_count',
  assigneeName: 'u.name',
} as const;

/** The shared filters (queue, map, statistics, exports) on a cases query aliased `c`, inside the viewer's scope. */
export function applyQueueFilter<B extends Knex.QueryBuilder>(b: B, viewer: Viewer, f: QueueFilter): B {
  whereCaseRight(b, viewer, 'view');
  if (f.status?.length === 1) b.where('c.status', f.status[0]);
  else if (f.status?.length) b.whereIn('c.status', f.status);
  if (f.assigneeId === 'none') b.whereNull('c.assignee_id');
  else if (f.assigneeId) b.where('c.assignee_id', f.assigneeId);
  if (f.band) b.whereRaw('c.bands @> array[?]::text[]', [f.band]);
  if (f.q) {
    const like = `%${f.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`;
    // The trigram index cases_search_trgm serves exactly this expression.
    b.whereRaw("(c.reference || ' ' || c.title || ' ' || c.description) ILIKE ?", [like]);
  }
  if (f.minDays !== undefined) b.whereRaw("c.status_since <= now() - make_interval(days => ?)", [f.minDays]);
  // ST_Intersects (inside or on the edge) does its own && on the GiST index cases_map_point_gist.
  if (f.area) b.whereRaw('ST_Intersects(c.map_point, ST_SetSRID(ST_GeomFromGeoJSON(?), 4326))', [JSON.stringify(areaPolygon(f.area))]);
  return b;
}

type Cursor = { v: string; id: string };
const encodeCursor = (c: Cursor) => Buffer.from(JSON.stringify([c.v, c.id])).toString('base64url');
function decodeCursor(s: string): Cursor {
  try {
    const [v, id] = JSON.parse(Buffer.from(s, 'base64url').toString('utf8'));
    if (typeof v === 'string' && typeof id === 'string' && /^[0-9a-f-]{36}$/i.test(id)) return { v, id };
  } catch {
    /* falls through */
  }
  throw badRequest('That page link is broken or out of date: start again from the first page.');
}

/**
 * The two queries of one queue page: the rows (keyset on the sort key and id, or OFFSET for ?page=N)
 * and the capped count. Built, not run, so the bench's minimal server runs exactly this SQL.
 */
export function queueQueries(viewer: Viewer, query: QueueQuery, q: Knex = db): { rows: Knex.QueryBuilder; count: Knex.QueryBuilder } {
  const key = SORT_KEYS[query.sort];
  const ascending = (query.dir === 'asc') !== Boolean(key.invert);
  const dir = ascending ? 'asc' : 'desc';
  const base = () => {
    const b = q('cases as c');
    if (query.sort === 'hunter') b.leftJoin('users as a', 'a.id', 'c.assignee_id');
    return applyQueueFilter(b, viewer, query);
  };
  const rows = base()
    .leftJoin('users as u', 'u.id', 'c.assignee_id')
    .select({ ...LIST_COLUMNS, updatedAt: 'c.updated_at', statusSince: 'c.status_since', assigneeId: 'c.assignee_id' })
    .select(q.raw(`(${key.expr})::text as sort_key`))
    .orderByRaw(`${key.expr} ${dir}, c.id ${dir}`)
    .limit(query.pageSize + 1);
  if (query.cursor) {
    const c = decodeCursor(query.cursor);
    rows.whereRaw(`(${key.expr}, c.id) ${ascending ? '>' : '<'} (?::${key.type}, ?::uuid)`, [c.v, c.id]);
  } else if (query.page > 1) {
    rows.offset((query.page - 1) * query.pageSize);
  }
  // Ordered like the page so PostgreSQL walks the same index and stops at the cap.
  const inner = base().select(q.raw('1')).orderByRaw(`${key.expr} ${dir}, c.id ${dir}`).limit(COUNT_CAP + 1);
  const count = q.from(inner.as('capped')).count<{ n: string }[]>({ n: '*' });
  return { rows, count };
}

/** One page of the committee's queue (or anyone's list of the cases they may see). */
export async function listQueue(viewer: Viewer, query: QueueQuery, q: Knex = db): Promise<QueuePage> {
  const { rows, count } = queueQueries(viewer, query, q);
  const [found, [{ n }]] = await Promise.all([rows, count]);
  const more = found.length > query.pageSize;
  const page = (more ? found.slice(0, query.pageSize) : found) as (QueueItem & { sort_key: string })[];
  const last = page.at(-1);
  const counted = Number(n);
  return {
    items: page.map(({ sort_key: _k, ...item }) => ({ ...item, fixSizeM: item.fixSizeM === null ? null : Number(item.fixSizeM) })),
    total: Math.min(counted, COUNT_CAP),
    totalCapped: counted > COUNT_CAP,
    page: query.page,
    pageSize: query.pageSize,
    nextCursor: more && last ? encodeCursor({ v: last.sort_key, id: last.id }) : null,
    sort: query.sort,
    dir: query.dir,
  };
}

/** Saved views of the queue, one list per person. */
export async function listSavedFilters(userId: string, q: Knex = db): Promise<{ id: string; name: string; query: string }[]> {
  return q('saved_filters').select('id', 'name', 'query').where({ user_id: userId }).orderBy('name');
}
export async function saveFilter(trx: Knex, userId: string, f: { name: string; query: string }): Promise<{ id: string; name: string; query: string }> {
  const [row] = await trx('saved_filters')
    .insert({ user_id: userId, name: f.name, query: f.query })
    .onConflict(['user_id', 'name'])
    .merge({ query: f.query })
    .returning(['id', 'name', 'query']);
  return row;
}
export async function deleteSavedFilter(trx: Knex, userId: string, id: string): Promise<boolean> {
  return (await trx('saved_filters').where({ id, user_id: userId }).delete()) > 0;
}
