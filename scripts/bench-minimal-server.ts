/**
 * The bench's baseline: node:http + pg, no framework, no session check, running exactly the SQL the
 * app runs (built by the same db/ functions, executed here through a plain pg pool). Started by
 * scripts/bench-api.ts:  tsx scripts/bench-minimal-server.ts PORT VIEWER_ID
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
const stats = memo<unknown>(30_000);

createServer(async (req, res) => {
  try {
    const url = new URL(req.url ?? '/', 'http://x');
    const sp = url.searchParams;
    let body: unknown;
    if (url.pathname === '/api/cases') {
      const { rows, count } = queueQueries(viewer, parseQueueParams(sp));
      const [items, [c]] = await Promise.all([run(rows), run(count)]);
      body = { items, total: Number(c.n) };
    } else if (url.pathname === '/api/cases/map') {
      const rows = await run(caseMapQuery(viewer, parseQueueFilter(sp), bboxSchema.parse(sp.get('bbox')), Number(sp.get('zoom')), sp.get('heat') === '1'));
      body = { cells: rows.map(toMapCell) };
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
