import type { Knex } from 'knex';
import { db } from './index';
import { applyQueueFilter } from './queue';
import type { Role } from './types';
import type { QueueFilter } from '@/lib/validation/queue';

type Viewer = { id: string; role: Role };
const OUTCOME_KEYS = ['fixed-by-owner', 'mitigated', 'utility-repaired', 'referred-to-regulator', 'stopped-on-its-own', 'not-found', 'duplicate'] as const;

/**
 * The statistics queries, every figure an SQL aggregate (built, not run, so the bench's minimal server
 * runs the same SQL). Milestones: a case has "reached located" at its first located_at, or, when it
 * skipped that state, when it was notified or resolved; likewise for notified.
 */
export function statsQueries(viewer: Viewer, f: QueueFilter, q: Knex = db) {
  const reachedLocated = 'coalesce(c.located_at, c.notified_at, c.resolved_at)';
  const reachedNotified = 'coalesce(c.notified_at, c.resolved_at)';
  const days = (a: string, b: string) => `extract(epoch from (${b} - ${a})) / 86400.0`;
  const median = (a: string, b: string) => q.raw(`percentile_cont(0.5) WITHIN GROUP (ORDER BY ${days(a, b)}) FILTER (WHERE ${a} IS NOT NULL AND ${b} IS NOT NULL)`);
  const weekly = applyQueueFilter(q('cases as c'), viewer, f)
    .joinRaw(`CROSS JOIN LATERAL (VALUES ('reported', c.created_at), ('located', ${reachedLocated}), ('notified', ${reachedNotified}), ('resolved', c.resolved_at)) AS m(milestone, at)`)
    .whereNotNull('m.at')
    .select(q.raw("to_char(date_trunc('week', m.at), 'YYYY-MM-DD') as week"), 'm.milestone', q.raw('count(*)::int as n'))
    .groupByRaw('1, 2')
    .orderByRaw('1, 2');
  const summary = applyQueueFilter(q('cases as c'), viewer, f).select({
    cases: q.raw('count(*)::int'),
    open: q.raw("count(*) FILTER (WHERE c.status = 'open')::int"),
    located: q.raw("count(*) FILTER (WHERE c.status = 'located')::int"),
    notified: q.raw("count(*) FILTER (WHERE c.status = 'notified')::int"),
    resolved: q.raw("count(*) FILTER (WHERE c.status = 'resolved')::int"),
    reportToLocated: median('c.created_at', reachedLocated),
    locatedToNotified: median(reachedLocated, reachedNotified),
    notifiedToResolved: median(reachedNotified, 'c.resolved_at'),
    reportToResolved: median('c.created_at', 'c.resolved_at'),
    measured: q.raw('count(*) FILTER (WHERE c.level_before_dbm IS NOT NULL AND c.level_after_dbm IS NOT NULL)::int'),
    reductionMedianDb: q.raw('percentile_cont(0.5) WITHIN GROUP (ORDER BY c.level_before_dbm - c.level_after_dbm) FILTER (WHERE c.level_before_dbm IS NOT NULL AND c.level_after_dbm IS NOT NULL)'),
    reductionMeanDb: q.raw('avg(c.level_before_dbm - c.level_after_dbm) FILTER (WHERE c.level_before_dbm IS NOT NULL AND c.level_after_dbm IS NOT NULL)'),
    ...Object.fromEntries(OUTCOME_KEYS.map((k) => [`outcome:${k}`, q.raw('count(*) FILTER (WHERE c.outcome = ?)::int', [k])])),
  });
  const load = applyQueueFilter(q('cases as c'), viewer, f)
    .join('users as u', 'u.id', 'c.assignee_id')
    .whereNot('c.status', 'resolved')
    .select({ hunterId: 'u.id', name: 'u.name' })
    .select(
      q.raw("count(*) FILTER (WHERE c.status = 'open')::int as open"),
      q.raw("count(*) FILTER (WHERE c.status = 'located')::int as located"),
      q.raw("count(*) FILTER (WHERE c.status = 'notified')::int as notified"),
      q.raw('count(*)::int as total'),
    )
    .groupBy('u.id', 'u.name')
    .orderByRaw('count(*) desc, u.name')
    .limit(100);
  return { weekly, summary, load };
}

export type StatsRows = {
  weekly: { week: string; milestone: 'reported' | 'located' | 'notified' | 'resolved'; n: number }[];
  summary: Record<string, number | string | null>;
  load: { hunterId: string; name: string; open: number; located: number; notified: number; total: number }[];
};

export async function statsRows(viewer: Viewer, f: QueueFilter): Promise<StatsRows> {
  const { weekly, summary, load } = statsQueries(viewer, f);
  const [w, [s], l] = await Promise.all([weekly, summary, load]);
  return { weekly: w, summary: s, load: l };
}
export { OUTCOME_KEYS };
