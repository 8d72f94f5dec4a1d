import { z } from 'zod';
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

/** The filters the queue, the map, the statistics and the exports share (the URL holds them). */
export const queueFilterSchema = z.object({
  status: statusList.optional(),
  /** a hunter's id, or "none" for unassigned cases */
  assigneeId: z.union([z.uuid(), z.literal('none')]).optional(),
  band: safeText().max(20).optional(),
  q: safeText().max(100).optional(),
  /** at least this many days in the current status */
  minDays: z.coerce.number().int().min(0).max(3650).optional(),
  area: bboxSchema.optional(),
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
