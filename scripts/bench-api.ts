/**
 * npm run bench:api — the committee's API at 100,000 cases (run `npm run seed:scale` first).
 * Starts, against SCALE_DB on DB_HOST/DB_PORT: the app (scripts/serve.ts), the minimal node:http + pg
 * server running the same SQL (scripts/bench-minimal-server.ts), and later a second app instance with
 * two outbox workers; drives each with autocannon (32 connections, 15 s, loopback) and prints
 * requests/s, p50, p95, p99 and the app/minimal ratios. Ports: BENCH_PORT_A (3081), BENCH_PORT_B
 * (3082), BENCH_MINIMAL_PORT (3083). BENCH_SECONDS shortens the runs for a quick look.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import pg from 'pg';

const DB = process.env.SCALE_DB ?? 'quietfix_scale';
const PORT_A = Number(process.env.BENCH_PORT_A ?? 3081);
const PORT_B = Number(process.env.BENCH_PORT_B ?? 3082);
const PORT_MIN = Number(process.env.BENCH_MINIMAL_PORT ?? 3083);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 15);
const CONNECTIONS = 32;
const ROOT = new URL('..', import.meta.url).pathname;

const SCENARIOS: { name: string; path: string; targetP95: number }[] = [
  { name: 'queue default view', path: '/api/cases', targetP95: 50 },
  { name: 'deep page (page=50)', path: '/api/cases?status=open&page=50', targetP95: 50 },
  { name: 'text search', path: '/api/cases?q=house%2042', targetP95: 200 },
  { name: 'map (zoom 13)', path: '/api/cases/map?bbox=129.70,-31.10,129.80,-31.00&zoom=13', targetP95: 200 },
  { name: 'stats', path: '/api/stats', targetP95: 200 },
];

const children: ChildProcess[] = [];
function start(name: string, args: string[], env: Record<string, string>) {
  const child = spawn(process.execPath, args, { cwd: ROOT, env: { ...process.env, ...env }, detached: true, stdio: ['ignore', 'ignore', 'inherit'] });
  children.push(child);
  child.on('exit', (code) => code && code !== 143 && console.error(`${name} exited with ${code}`));
  return child;
}
function stopAll() {
  for (const c of children) if (c.pid && c.exitCode === null) try { process.kill(-c.pid, 'SIGTERM'); } catch { /* gone */ }
}
process.on('exit', stopAll);
process.on('SIGINT', () => process.exit(130));

async function waitHttp(url: string, seconds = 90) {
  for (let i = 0; i < seconds * 4; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch { /* not yet */ }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer`);
}

async function signIn(base: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
  const { csrfToken } = await csrf.json();
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST', redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base, cookie: cookies.join('; ') },
    body: new URLSearchParams({ csrfToken, email: 'coordinator@example.test', password: 'quietfix-demo', json: 'true' }),
  });
  const all = [...cookies, ...res.headers.getSetCookie().map((c) => c.split(';')[0])];
  if (!all.some((c) => c.startsWith('next-auth.session-token'))) throw new Error(`sign-in failed (${res.status}); did you run npm run seed:scale?`);
  return all.join('; ');
}

type Figures = { rps: number; p50: number; p95: number; p99: number; errors: number };
const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN);

/** Drives the given bases at once (connections split evenly), latencies pooled. */
async function drive(bases: string[], path: string, cookie: string): Promise<Figures> {
  const latencies: number[] = [];
  let errors = 0;
  const results = await Promise.all(
    bases.map(
      (base) =>
        new Promise<autocannon.Result>((resolve, reject) => {
          const inst = autocannon({ url: base + path, connections: CONNECTIONS / bases.length, duration: SECONDS, headers: { cookie } }, (err, r) => (err ? reject(err) : resolve(r)));
          inst.on('response', (_c: unknown, status: number, _b: number, ms: number) => {
            latencies.push(ms);
            if (status !== 200) errors++;
          });
        }),
    ),
  );
  latencies.sort((a, b) => a - b);
  const total = results.reduce((s, r) => s + r.requests.total, 0);
  return { rps: total / SECONDS, p50: pct(latencies, 50), p95: pct(latencies, 95), p99: pct(latencies, 99), errors: errors + results.reduce((s, r) => s + r.errors + r.timeouts, 0) };
}

async function main() {
  const build = spawnSync('bash', ['-c', 'source scripts/lib.sh && ensure_secret && ensure_build'], { cwd: ROOT, stdio: 'inherit' });
  if (build.status !== 0) throw new Error('next build failed');
  const secret = process.env.NEXTAUTH_SECRET ?? readFileSync(`${ROOT}.data/nextauth-secret`, 'utf8').trim();
  const dbEnv = { DB_NAME: DB, DB_HOST: process.env.DB_HOST ?? '127.0.0.1', DB_PORT: process.env.DB_PORT ?? '54329', NODE_ENV: 'production', NEXTAUTH_SECRET: secret, NEXT_TELEMETRY_DISABLED: '1', DB_POOL_MAX: '10' };
  const appEnv = (port: number) => ({ ...dbEnv, APP_URL: `http://127.0.0.1:${port}`, NEXTAUTH_URL: `http://127.0.0.1:${port}` });
  const serve = (port: number) => start(`app :${port}`, ['--import', 'tsx', 'scripts/serve.ts', '-p', String(port), '-H', '127.0.0.1'], appEnv(port));

  const client = new pg.Client({ host: dbEnv.DB_HOST, port: Number(dbEnv.DB_PORT), user: process.env.DB_USER ?? 'quietfix', password: process.env.DB_PASSWORD ?? 'quietfix-local', database: DB });
  await client.connect();
  const { rows } = await client.query("SELECT id, (SELECT count(*) FROM cases) AS cases, (SELECT count(*) FROM bearings) AS bearings FROM users WHERE email = 'coordinator@example.test'");
  await client.end();
  if (!rows.length) throw new Error(`no coordinator in ${DB}: run npm run seed:scale first`);
  console.log(`bench:api on ${DB}: ${rows[0].cases} cases, ${rows[0].bearings} bearings; ${CONNECTIONS} connections, ${SECONDS} s per run, loopback`);

  start('minimal', ['--import', 'tsx', 'scripts/bench-minimal-server.ts', String(PORT_MIN), rows[0].id], dbEnv);
  serve(PORT_A);
  await Promise.all([waitHttp(`http://127.0.0.1:${PORT_A}/api/health`), waitHttp(`http://127.0.0.1:${PORT_MIN}/api/stats`)]);
  const cookie = await signIn(`http://127.0.0.1:${PORT_A}`);
  const one: Record<string, { app: Figures; minimal: Figures }> = {};
  for (const s of SCENARIOS) {
    await fetch(`http://127.0.0.1:${PORT_A}${s.path}`, { headers: { cookie } }); // warm
    one[s.name] = { minimal: await drive([`http://127.0.0.1:${PORT_MIN}`], s.path, ''), app: await drive([`http://127.0.0.1:${PORT_A}`], s.path, cookie) };
  }
  // Two instances and two workers against the one PostgreSQL; the session made on A is used on both.
  serve(PORT_B);
  for (const w of [1, 2]) start(`worker ${w}`, ['--import', 'tsx', 'scripts/outbox-worker.ts'], dbEnv);
  await waitHttp(`http://127.0.0.1:${PORT_B}/api/health`);
  const two: Record<string, Figures> = {};
  for (const s of SCENARIOS) {
    await fetch(`http://127.0.0.1:${PORT_B}${s.path}`, { headers: { cookie } });
    two[s.name] = await drive([`http://127.0.0.1:${PORT_A}`, `http://127.0.0.1:${PORT_B}`], s.path, cookie);
  }

  const f = (x: Figures) => `${x.rps.toFixed(0).padStart(6)} ${x.p50.toFixed(0).padStart(5)} ${x.p95.toFixed(0).padStart(5)} ${x.p99.toFixed(0).padStart(5)}${x.errors ? ` (${x.errors} errors)` : ''}`;
  console.log('\nscenario                 | minimal req/s p50 p95 p99 (ms) | app, 1 instance          | ratio | app, 2 instances         | p95 target');
  for (const s of SCENARIOS) {
    const { app, minimal } = one[s.name];
    console.log(
      `${s.name.padEnd(24)} | ${f(minimal)} | ${f(app)} | ${((100 * app.rps) / minimal.rps).toFixed(0).padStart(4)}% | ${f(two[s.name])} | < ${s.targetP95} ms: 1 inst ${app.p95 < s.targetP95 ? 'met' : 'missed'}, 2 inst ${two[s.name].p95 < s.targetP95 ? 'met' : 'missed'}`,
    );
  }
  console.log('\n(ratio: app requests/s over the minimal server\'s; the stats answer is cached for 30 s in both servers alike)');
}

main()
  .catch((err) => {
    console.error('bench:api failed:', err.message);
    process.exitCode = 1;
  })
  .finally(stopAll);
