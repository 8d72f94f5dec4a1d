import { z } from 'zod';
import { kinks, polygon } from '@turf/turf';
import { CASE_STATUSES } from '@/db/types';
import { MAX_PAGE_SIZE } from '@/lib/api/paging';
import { safeText } from './text';

/** Columns the committee's queue sorts by on the server. */
export const QUEUE_SORTS = ['reference', 'status', 'stateAge', 'band', 'hunter', 'lastActivity', 'fixSize', 'notices'] as const;
export type QueueSort = (typeof QUEUE_SORTS)[number];

const statusList = safeText()
  .max(60)
  .transform((s, ctx) => {
    const parts = s.split(',').map((x) => x.trim()).filter(Boolean);
    const bad = parts.find((p) => !(CASE_STATUSES as readonly string[]).includes(p));
    if (bad) {
      ctx.addIssue({ code: 'custom', message: `Unknown status "${bad}": use ${CASE_STATUSES.join(', ')}.` });
      return z.NEVER;
    }
    return [...new Set(parts)] as (typeof CASE_STATUSES)[number][];
  });

/** A box drawn on the map: west,south,east,north in degrees (WGS84). */
export const bboxSchema = safeText()
  .max(120)
  .transform((s, ctx) => {
    const n = s.split(',').map(Number);
    const [w, so, e, no] = n;
    if (n.length !== 4 || n.some((x) => !Number.isFinite(x)) || w < -180 || e > 180 || so < -90 || no > 90 || w >= e || so >= no) {
      ctx.addIssue({ code: 'custom', message: 'An area is west,south,east,north in degrees, west below east and south below north.' });
      return z.NEVER;
    }
    return { west: w, south: so, east: e, north: no };
  });
export type Bbox = { west: number; south: number; east: number; north: number };

/** Vertices a drawn area may have. */
export const AREA_MIN_VERTICES = 3;
export const AREA_MAX_VERTICES = 50;

/** An area drawn on the map: its vertices as [lon, lat] degrees (WGS84), the ring not closed. */
export type Area = { vertices: [number, number][] };

/** The area as URL text: `lon,lat;lon,lat;…` to 5 decimals (about a metre). */
export const areaText = (a: Area) => a.vertices.map(([lon, lat]) => `${lon.toFixed(5)},${lat.toFixed(5)}`).join(';');

/** The area as a closed GeoJSON Polygon ring (RFC 7946 §3.1.6). */
export const areaPolygon = (a: Area) => ({ type: 'Polygon' as const, coordinates: [[...a.vertices, a.vertices[0]]] });

/**
 * `area=`: a polygon drawn on the map, `lon,lat;lon,lat;…` (3 to 50 vertices; a last vertex equal
 * to the first is dropped), in plain longitude/latitude (not across the antimeridian), not
 * crossing itself (Turf's kinks) and enclosing some ground. The older box form `west,south,east,north`
 * (no semicolon) still works and becomes its four corners.
 */
export const areaSchema = safeText()
  .max(2000)
  .transform((s, ctx): Area => {
    const fail = (message: string) => {
      ctx.addIssue({ code: 'custom', message });
      return z.NEVER;
    };
    if (!s.includes(';')) {
      const box = bboxSchema.safeParse(s);
      if (!box.success) return fail('An area is lon,lat;lon,lat;… (3 to 50 points drawn on the map), or a box west,south,east,north.');
      const { west: w, south: so, east: e, north: n } = box.data;
      return { vertices: [[w, so], [e, so], [e, n], [w, n]] };
    }
    const vertices: [number, number][] = [];
    for (const [i, pair] of s.split(';').entries()) {
      const parts = pair.split(',');
      const [lon, lat] = parts.map((x) => (x.trim() === '' ? NaN : Number(x)));
      if (parts.length !== 2 || !Number.isFinite(lon) || !Number.isFinite(lat)) return fail(`Point ${i + 1} of the area is not lon,lat in degrees.`);
      if (lon < -180 || lon > 180 || lat < -90 || lat > 90) return fail(`Point ${i + 1} of the area is off the globe: longitude runs −180 to 180, latitude −90 to 90.`);
      vertices.push([lon, lat]);
    }
    const last = vertices.at(-1)!;
    if (vertices.length > 1 && last[0] === vertices[0][0] && last[1] === vertices[0][1]) vertices.pop();
    if (vertices.length < AREA_MIN_VERTICES) return fail(`An area needs at least ${AREA_MIN_VERTICES} points.`);
    if (vertices.length > AREA_MAX_VERTICES) return fail(`An area takes at most ${AREA_MAX_VERTICES} points; this one has ${vertices.length}.`);
    if (vertices.some((v, i) => i > 0 && v[0] === vertices[i - 1][0] && v[1] === vertices[i - 1][1])) return fail('The area has the same point twice in a row.');
    const shape = polygon(areaPolygon({ vertices }).coordinates);
    if (kinks(shape).features.length > 0) return fail('The area crosses itself: draw its edges so that no two of them cross.');
    // Planar, as PostGIS treats a geometry in lon/lat: the shoelace formula, square degrees.
    const planar = vertices.reduce((sum, [x1, y1], i) => { const [x2, y2] = vertices[(i + 1) % vertices.length]; return sum + x1 * y2 - x2 * y1; }, 0) / 2;
    if (Math.abs(planar) < 1e-10) return fail('The area encloses no ground (its points lie on one line).');
    return { vertices };
  });

/** The filters the queue, the map, the statistics and the exports share (the URL holds them). */
export const queueFilterSchema = z.object({
  status: statusList.optional(),
  /** a hunter's id, or "none" for unassigned cases */
  assigneeId: z.union([z.uuid(), z.literal('none')]).optional(),
  band: safeText().max(20).optional(),
  q: safeText().max(100).optional(),
  /** at least this many days in the current status */
  minDays: z.coerce.number().int().min(0).max(3650).optional(),
  area: areaSchema.optional(),
});
export type QueueFilter = z.infer<typeof queueFilterSchema>;

export const queueQuerySchema = queueFilterSchema.extend({
  sort: z.enum(QUEUE_SORTS).default('lastActivity'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  /** keyset cursor from a previous answer's nextCursor (takes precedence over page) */
  cursor: safeText().max(400).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).default(25).transform((n) => Math.min(n, MAX_PAGE_SIZE)),
});
export type QueueQuery = z.infer<typeof queueQuerySchema>;

/** Reads the shared filters (and, with `withPaging`, sort and paging) from a URL's query. Empty values count as absent. */
export function parseQueueParams(sp: URLSearchParams): QueueQuery {
  const raw: Record<string, string> = {};
  for (const [k, v] of sp) if (v !== '' && k in queueQuerySchema.shape) raw[k] = v;
  return queueQuerySchema.parse(raw);
}
export function parseQueueFilter(sp: URLSearchParams): QueueFilter {
  const raw: Record<string, string> = {};
  for (const [k, v] of sp) if (v !== '' && k in queueFilterSchema.shape) raw[k] = v;
  return queueFilterSchema.parse(raw);
}

export const bulkAssignSchema = z.object({
  caseIds: z.array(z.uuid()).min(1).max(MAX_PAGE_SIZE),
  assigneeId: z.uuid().nullable(),
});

export const savedFilterSchema = z.object({
  name: safeText().trim().min(1, 'Give the view a name.').max(60),
  query: safeText().max(1000),
});
