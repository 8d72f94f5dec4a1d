/**
 * The bench's baseline: node:http + pg, no framework, no session check, running exactly the SQL the
 * app runs (built by the same db/ functions, executed here through a plain pg pool), with the app's
 * caches: lists kept under the data revision (lib/cache/case-lists.ts), statistics for 30 s (lib/stats/memo.ts).
 * With MINIMAL_CACHE=0 it keeps nothing and runs the lists' and statistics' SQL on every request
 * (what the app would cost without its caches). Started by scripts/bench-api.ts:
 *   tsx scripts/bench-minimal-server.ts PORT VIEWER_ID
 */
import { createServer } from 'node:http';
import pg from 'pg';
import type { Knex } from 'knex';
import { queueQueries } from '../db/queue';
import { caseMapQuery, toMapCell } from '../db/case-map';
import { statsQueries } from '../db/stats';
import { bboxSchema, parseQueueFilter, parseQueueParams } from '../lib/validation/queue';
import { shapeStats } from '../lib/stats/shape';
import { memo } from '../lib/stats/memo';
import { cachedCaseList } from '../lib/cache/case-lists';
import { revisionQuery } from '../db/revisions';

const [port, viewerId] = [Number(process.argv[2]), process.argv[3]];
const viewer = { id: viewerId, role: 'coordinator' as const };
const pool = new pg.Pool({
  host: process.env.DB_HOST ?? '127.0.0.1',
  port: Number(process.env.DB_PORT),
  user: process.env.DB_USER ?? 'quietfix',
  password: process.env.DB_PASSWORD ?? 'quietfix-local',
  database: process.env.DB_NAME,
  max: Number(process.env.DB_POOL_MAX ?? 10),
});
const run = async (b: Knex.QueryBuilder) => {
  const { sql, bindings } = b.toSQL().toNative();
  return (await pool.query(sql, bindings as unknown[])).rows;
};
const caching = process.env.MINIMAL_CACHE !== '0';
const kept = memo<object>(30_000);
const stats = (key: string, compute: () => Promise<object>) => (caching ? kept(key, compute) : compute());
/** Through lib/cache/case-lists.ts, as the app: one revision read, then the kept answer or the SQL. */
const listed = async (kind: 'queue' | 'map', params: unknown, compute: () => Promise<object>) => {
  if (!caching) return compute();
  const [{ rev }] = await run(revisionQuery('cases'));
  return cachedCaseList(viewer, String(rev), kind, params, compute);
};

createServer(async (req, res) => {
  try {
    const url = new URL(req.url ?? '/', 'http://x');
    const sp = url.searchParams;
    let body: unknown;
    if (url.pathname === '/api/cases') {
      const params = parseQueueParams(sp);
      body = await listed('queue', params, async () => {
        const { rows, count } = queueQueries(viewer, params);
        const [items, [c]] = await Promise.all([run(rows), run(count)]);
        return { items, total: Number(c.n) };
      });
    } else if (url.pathname === '/api/cases/map') {
      const filter = parseQueueFilter(sp);
      const p = { bbox: bboxSchema.parse(sp.get('bbox')), zoom: Number(sp.get('zoom')), heat: sp.get('heat') === '1' };
      body = await listed('map', { filter, ...p }, async () => ({ cells: (await run(caseMapQuery(viewer, filter, p.bbox, p.zoom, p.heat))).map(toMapCell) }));
    } else if (url.pathname === '/api/stats') {
      const f = parseQueueFilter(sp);
      body = await stats(JSON.stringify(f), async () => {
        const q = statsQueries(viewer, f);
        const [weekly, [summary], load] = await Promise.all([run(q.weekly), run(q.summary), run(q.load)]);
        return shapeStats({ weekly, summary, load } as never);
      });
    } else {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(body));
  } catch (err) {
    res.writeHead(500, { 'content-type': 'application/json' }).end(JSON.stringify({ error: (err as Error).message }));
  }
}).listen(port, '127.0.0.1', () => console.log(`minimal server on ${port}`));
