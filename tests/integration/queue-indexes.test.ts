import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import type { Knex } from 'knex';
import { applyQueueFilter, queueQueries } from '@/db/queue';
import { caseMapQuery } from '@/db/case-map';
import { statsQueries } from '@/db/stats';
import { parseQueueFilter, parseQueueParams } from '@/lib/validation/queue';

/**
 * The queries the bench measures (scripts/bench-api.ts) can be served by the indexes in
 * migrations/20261202060000_committee_queue.ts: with sequential scans priced out
 * (enable_seqscan = off — the test database is small, where a seq scan is the cheaper plan), no
 * plan reads the cases table sequentially. At 100,000 cases the planner picks the same indexes
 * on its own: cases_queue_last_activity_at for the default view, cases_queue_status_last_activity_at
 * for a status page, cases_queue_status_status_since for "oldest in state" (EXPLAIN ANALYZE on
 * the seed:scale database). On a small table any index of the family is a valid plan.
 */
const coordinator = { id: '00000000-0000-0000-0000-000000000000', role: 'coordinator' as const };

type PlanNode = { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; Plans?: PlanNode[] };
const nodes = (p: PlanNode): PlanNode[] => [p, ...(p.Plans ?? []).flatMap(nodes)];

async function plan(b: Knex.QueryBuilder): Promise<PlanNode[]> {
  const { sql, bindings } = b.toSQL();
  return db.transaction(async (trx) => {
    await trx.raw('SET LOCAL enable_seqscan = off');
    const r = await trx.raw(`EXPLAIN (FORMAT JSON) ${sql}`, bindings as Knex.RawBinding[]);
    return nodes(r.rows[0]['QUERY PLAN'][0].Plan);
  });
}

/** No sequential scan of cases, and the index meant for the query exists (which one a tiny table's plan takes varies). */
async function expectNoSeqScanOfCases(ns: PlanNode[], indexes: RegExp) {
  expect(ns.filter((n) => n['Node Type'] === 'Seq Scan' && n['Relation Name'] === 'cases')).toEqual([]);
  expect(ns.some((n) => n['Relation Name'] === 'cases' || n['Index Name'])).toBe(true);
  const { rows } = await db.raw("SELECT indexname FROM pg_indexes WHERE tablename = 'cases'");
  expect(rows.map((r: { indexname: string }) => r.indexname).join(' ')).toMatch(indexes);
}

describe('the measured queries use our indexes (EXPLAIN, no sequential scan of cases)', () => {
  const QUEUE: [string, string, RegExp][] = [
    // the default view of a coordinator: at 100,000 cases the plan is cases_queue_last_activity_at (see the closing note)
    ['queue default view', '', /cases_queue_/],
    ['deep page', 'status=open&page=50', /cases_queue_status_/],
    ['keyset page', 'status=open&cursor=WyIyMDI2LTAxLTAxIDAwOjAwOjAwKzAwIiwiMDAwMDAwMDAtMDAwMC0wMDAwLTAwMDAtMDAwMDAwMDAwMDAwIl0', /cases_queue_status_/],
    ['oldest in state', 'status=open&sort=stateAge&dir=desc', /cases_queue_status_/],
    ['text search', 'q=house 42', /cases_search_trgm|cases_queue_last_activity_at/],
    ['a hunter\'s own list', '', /cases_queue_assignee_activity|cases_assignee_id_index/],
    ['an area drawn on the map', 'area=129.74,-31.06;129.76,-31.06;129.75,-31.04', /cases_map_point_gist/],
  ];
  it.each(QUEUE)('%s', async (name, qs, indexes) => {
    const viewer = name.startsWith('a hunter') ? { ...coordinator, role: 'hunter' as const } : coordinator;
    const { rows, count } = queueQueries(viewer, parseQueueParams(new URLSearchParams(qs)));
    await expectNoSeqScanOfCases(await plan(rows), indexes);
    await expectNoSeqScanOfCases(await plan(count), indexes);
  });

  it('map', async () => {
    const q = caseMapQuery(coordinator, parseQueueFilter(new URLSearchParams()), { west: 129.7, south: -31.1, east: 129.8, north: -31.0 }, 13, false);
    await expectNoSeqScanOfCases(await plan(q), /cases_map_point_gist/);
  });

  it('an area drawn on the map is served by the GiST index on map_point', async () => {
    // The filter alone (as the set export and the statistics apply it), without a sort that a b-tree could serve.
    const ns = await plan(applyQueueFilter(db('cases as c'), coordinator, parseQueueFilter(new URLSearchParams('area=129.74,-31.06;129.76,-31.06;129.75,-31.04'))).select('c.id'));
    await expectNoSeqScanOfCases(ns, /cases_map_point_gist/);
    expect(ns.some((n) => n['Index Name'] === 'cases_map_point_gist')).toBe(true);
  });

  it('statistics', async () => {
    const { weekly, summary, load } = statsQueries(coordinator, parseQueueFilter(new URLSearchParams()));
    for (const q of [weekly, summary, load]) await expectNoSeqScanOfCases(await plan(q), /cases_stats_cover/);
  });
});
