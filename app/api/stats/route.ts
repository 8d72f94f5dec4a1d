import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { statsRows } from '@/db/stats';
import { parseQueueFilter } from '@/lib/validation/queue';
import { shapeStats, type Stats } from '@/lib/stats/shape';
import { memo } from '@/lib/stats/memo';

/** Committee figures for the cases matching the queue's filters, at most 30 seconds old (plus one computation: older figures answer while fresh ones are worked out). */
const STATS_TTL_MS = 30_000;
const cached = memo<Stats>(STATS_TTL_MS);

export const GET = route(async (req) => {
  const me = await requireUser('admin', 'coordinator');
  const filter = parseQueueFilter(req.nextUrl.searchParams);
  // Committee members all see every case, so one entry per filter serves them all.
  return json(await cached(JSON.stringify(filter), async () => shapeStats(await statsRows(me, filter))));
});
