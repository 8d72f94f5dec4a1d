import type { Knex } from 'knex';
import { db } from './index';
import { applyQueueFilter } from './queue';
import type { CaseStatus, Role } from './types';
import type { Bbox, QueueFilter } from '@/lib/validation/queue';

/** At most this many clusters and points in one answer. */
export const MAP_CELL_LIMIT = 3000;

/** Grid cell (degrees) for a zoom level: about 60 screen pixels of a 256-pixel Web Mercator tile. */
export const cellDegrees = (zoom: number) => (360 * 60) / (256 * 2 ** zoom);

export type MapCell = {
  lat: number;
  lon: number;
  count: number;
  byStatus: Record<CaseStatus, number>;
  /** set when the cell holds one case */
  case: { id: string; reference: string; title: string; status: CaseStatus } | null;
};

/**
 * Cases inside the box, clustered on the server by snapping to a grid sized for the zoom
 * (PostGIS ST_SnapToGrid); the same filters and visibility as the queue. `heat` counts open cases
 * on a finer grid.
 */
export function caseMapQuery(viewer: { id: string; role: Role }, f: QueueFilter, box: Bbox, zoom: number, heat: boolean, q: Knex = db): Knex.QueryBuilder {
  const cell = cellDegrees(zoom) / (heat ? 3 : 1);
  const b = applyQueueFilter(q('cases as c'), viewer, heat ? { ...f, status: ['open'] } : f)
    .whereRaw('c.map_point && ST_MakeEnvelope(?, ?, ?, ?, 4326)', [box.west, box.south, box.east, box.north])
    .select(
      q.raw('count(*)::int as count'),
      q.raw('ST_Y(ST_Centroid(ST_Collect(c.map_point))) as lat'),
      q.raw('ST_X(ST_Centroid(ST_Collect(c.map_point))) as lon'),
      q.raw("count(*) FILTER (WHERE c.status = 'open')::int as open"),
      q.raw("count(*) FILTER (WHERE c.status = 'located')::int as located"),
      q.raw("count(*) FILTER (WHERE c.status = 'notified')::int as notified"),
      q.raw("count(*) FILTER (WHERE c.status = 'resolved')::int as resolved"),
      q.raw('CASE WHEN count(*) = 1 THEN (array_agg(c.id))[1] END as case_id'),
      q.raw('CASE WHEN count(*) = 1 THEN min(c.reference) END as reference'),
      q.raw('CASE WHEN count(*) = 1 THEN min(c.title) END as title'),
      q.raw('CASE WHEN count(*) = 1 THEN min(c.status) END as status'),
    )
    .groupByRaw('ST_SnapToGrid(c.map_point, ?)', [cell])
    .limit(MAP_CELL_LIMIT + 1);
  return b;
}

type CellRow = { count: number; lat: number; lon: number; open: number; located: number; notified: number; resolved: number; case_id: string | null; reference: string | null; title: string | null; status: CaseStatus | null };

export function toMapCell(r: CellRow): MapCell {
  return {
    lat: Number(r.lat),
    lon: Number(r.lon),
    count: r.count,
    byStatus: { open: r.open, located: r.located, notified: r.notified, resolved: r.resolved },
    case: r.case_id ? { id: r.case_id, reference: r.reference!, title: r.title!, status: r.status! } : null,
  };
}

export async function caseMap(viewer: { id: string; role: Role }, f: QueueFilter, box: Bbox, zoom: number, heat: boolean): Promise<{ cells: MapCell[]; truncated: boolean; cellDeg: number }> {
  const rows = (await caseMapQuery(viewer, f, box, zoom, heat)) as CellRow[];
  return { cells: rows.slice(0, MAP_CELL_LIMIT).map(toMapCell), truncated: rows.length > MAP_CELL_LIMIT, cellDeg: cellDegrees(zoom) / (heat ? 3 : 1) };
}

/** Where the map of all cases opens: the most recently active case the viewer may see that has a position. */
export async function mapStart(viewer: { id: string; role: Role }, q: Knex = db): Promise<{ lat: number; lon: number } | null> {
  const row = await applyQueueFilter(q('cases as c'), viewer, {})
    .whereNotNull('c.map_point')
    .select(q.raw('ST_Y(c.map_point) as lat'), q.raw('ST_X(c.map_point) as lon'))
    .orderBy([{ column: 'c.last_activity_at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
    .first();
  return row ? { lat: Number(row.lat), lon: Number(row.lon) } : null;
}
