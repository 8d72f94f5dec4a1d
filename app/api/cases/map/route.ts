import { z } from 'zod';
import { route, json } from '@/lib/api/handler';
import { requireUserAndCasesRevision } from '@/lib/auth/session';
import { caseMap } from '@/db/case-map';
import { bboxSchema, parseQueueFilter } from '@/lib/validation/queue';
import { cachedCaseList } from '@/lib/cache/case-lists';

const mapParams = z.object({
  bbox: bboxSchema,
  zoom: z.coerce.number().int().min(0).max(22),
  heat: z.enum(['0', '1']).default('0'),
});

/** The map of all cases the caller may see: clusters and single cases in the box, with the queue's filters; kept until a case changes. */
export const GET = route(async (req) => {
  const { me, casesRevision } = await requireUserAndCasesRevision();
  const sp = req.nextUrl.searchParams;
  const p = mapParams.parse({ bbox: sp.get('bbox') ?? undefined, zoom: sp.get('zoom') ?? undefined, heat: sp.get('heat') ?? undefined });
  const filter = parseQueueFilter(sp);
  return json(await cachedCaseList(me, casesRevision, 'map', { filter, ...p }, () => caseMap(me, filter, p.bbox, p.zoom, p.heat === '1')));
});
