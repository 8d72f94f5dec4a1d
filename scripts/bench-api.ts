/**
 * npm run bench:api — the committee's API at 100,000 cases (run `npm run seed:scale` first).
 * Starts, against SCALE_DB on DB_HOST/DB_PORT: the app (scripts/serve.ts), the minimal node:http + pg
 * server running the same SQL with the same caches (scripts/bench-minimal-server.ts), the same server
 * keeping nothing (the SQL on every request: what a cache miss costs), and later a second app instance with
 * two outbox workers; drives each with autocannon (32 connections, 15 s, loopback) and prints
 * requests/s, p50, p95, p99, the servers' CPU per request and the app/minimal ratios. Both app
 * instances and both workers use one object-storage fake (scripts/s3-fake.ts, data in
 * .data/s3-bench): after the read scenarios, BENCH_UPLOADS recordings (default 40) are uploaded
 * through both instances (presign, PUT to the store, complete) and the two workers analyse them.
 * Ports: BENCH_PORT_A (3081), BENCH_PORT_B (3082), BENCH_MINIMAL_PORT (3083, and the next one for the
 * server that keeps nothing), BENCH_S3_PORT (4591).
 * BENCH_SECONDS shortens the runs for a quick look.
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
const S3_PORT = Number(process.env.BENCH_S3_PORT ?? 4591);
const UPLOADS = Number(process.env.BENCH_UPLOADS ?? 40);
const UPLOAD_PARALLEL = 8;
const ROOT = new URL('..', import.meta.url).pathname;

const SCENARIOS: { name: string; path: string; targetP95: number }[] = [
  { name: 'queue default view', path: '/api/cases', targetP95: 50 },
  { name: 'deep page (page=50)', path: '/api/cases?status=open&page=50', targetP95: 50 },
  { name: 'text search', path: '/api/cases?q=house%2042', targetP95: 200 },
  { name: 'map (zoom 13)', path: '/api/cases/map?bbox=129.70,-31.10,129.80,-31.00&zoom=13', targetP95: 200 },
  { name: 'stats', path: '/api/stats', targetP95: 200 },
];

const DB_HOST = process.env.DB_HOST ?? '127.0.0.1';
const DB_PORT = process.env.DB_PORT ?? '54329';
const scaleDb = () =>
  new pg.Client({ host: DB_HOST, port: Number(DB_PORT), user: process.env.DB_USER ?? 'quietfix', password: process.env.DB_PASSWORD ?? 'quietfix-local', database: DB });

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

type Figures = { rps: number; p50: number; p95: number; p99: number; errors: number; cpuMs: number };

/** CPU time (user + system, all threads) a process has used so far, in ms (Linux /proc; clock ticks at 100 Hz). */
function cpuMsOf(pid: number | undefined): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) * 10;
  } catch {
    return NaN;
  }
}
const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN);

/**
 * Drives the given bases at once (connections split evenly), latencies pooled. `pids` are the
 * server processes behind them: their CPU time per request is the figure least moved by other
 * load on the machine.
 */
async function drive(bases: string[], path: string, cookie: string, pids: (number | undefined)[]): Promise<Figures> {
  // Warm first (JIT, pools, caches), unmeasured: the figures are for a server that has been running.
  await Promise.all(bases.map((base) => autocannon({ url: base + path, connections: 8, duration: Math.min(3, SECONDS), headers: { cookie } })));
  const cpu0 = pids.reduce<number>((sum, p) => sum + cpuMsOf(p), 0);
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
  const cpuMs = (pids.reduce<number>((sum, p) => sum + cpuMsOf(p), 0) - cpu0) / Math.max(total, 1);
  return { cpuMs, rps: total / SECONDS, p50: pct(latencies, 50), p95: pct(latencies, 95), p99: pct(latencies, 99), errors: errors + results.reduce((s, r) => s + r.errors + r.timeouts, 0) };
}

/** A 2 s, 8 kHz, 16-bit mono WAV: a 50 Hz family of harmonics over a little noise (seeded). */
function benchWav(): Uint8Array<ArrayBuffer> {
  const rate = 8000, n = rate * 2;
  const out = Buffer.alloc(44 + n * 2);
  out.write('RIFF', 0); out.writeUInt32LE(36 + n * 2, 4); out.write('WAVEfmt ', 8);
  out.writeUInt32LE(16, 16); out.writeUInt16LE(1, 20); out.writeUInt16LE(1, 22); out.writeUInt32LE(rate, 24);
  out.writeUInt32LE(rate * 2, 28); out.writeUInt16LE(2, 32); out.writeUInt16LE(16, 34); out.write('data', 36); out.writeUInt32LE(n * 2, 40);
  let seed = 7;
  for (let i = 0; i < n; i++) {
    seed = (seed * 1103515245 + 12345) % 2 ** 31;
    let v = 0.05 * (seed / 2 ** 31 - 0.5);
    for (let h = 1; h <= 8; h++) v += (0.3 / h) * Math.sin((2 * Math.PI * 50 * h * i) / rate);
    out.writeInt16LE(Math.round(Math.max(-1, Math.min(1, v)) * 32000), 44 + i * 2);
  }
  return new Uint8Array(out);
}

/** Uploads UPLOADS recordings to one case, alternating instances; waits for the workers' analyses. */
async function uploadRound(bases: string[], cookie: string) {
  const wav = benchWav();
  const headers = (base: string) => ({ cookie, origin: base, 'content-type': 'application/json' });
  const list = await (await fetch(`${bases[0]}/api/cases?status=open&pageSize=1`, { headers: { cookie } })).json();
  const caseId = list.items[0].id as string;
  const times: number[] = [];
  const ids: string[] = [];
  let next = 0;
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: UPLOAD_PARALLEL }, async () => {
      while (next < UPLOADS) {
        const i = next++;
        const base = bases[i % bases.length];
        const start = performance.now();
        const ask = await fetch(`${base}/api/cases/${caseId}/files`, { method: 'POST', headers: headers(base), body: JSON.stringify({ name: `bench-${i}.wav`, size: wav.length, contentType: 'audio/wav' }) });
        if (ask.status !== 201) throw new Error(`presign answered ${ask.status}: ${await ask.text()}`);
        const ticket = await ask.json();
        const put = await fetch(ticket.uploadUrl, { method: 'PUT', headers: ticket.headers, body: wav });
        if (!put.ok) throw new Error(`the object store answered ${put.status} to the PUT`);
        const done = await fetch(`${base}/api/cases/${caseId}/files/${ticket.fileId}/complete`, { method: 'POST', headers: headers(base), body: '{}' });
        if (done.status !== 200) throw new Error(`complete answered ${done.status}: ${await done.text()}`);
        times.push(performance.now() - start);
        ids.push(ticket.fileId);
      }
    }),
  );
  const uploadedAt = performance.now();
  const client = scaleDb();
  await client.connect();
  let analysed = 0;
  for (let i = 0; i < 600 && analysed < ids.length; i++) {
    const { rows } = await client.query("SELECT count(*)::int AS n FROM case_files WHERE id = ANY($1) AND analysis->>'status' IN ('ready', 'refused', 'failed')", [ids]);
    analysed = rows[0].n;
    if (analysed < ids.length) await new Promise((r) => setTimeout(r, 250));
  }
  await client.end();
  times.sort((a, b) => a - b);
  return { bytes: wav.length, perSecond: (1000 * UPLOADS) / (uploadedAt - t0), p50: pct(times, 50), p95: pct(times, 95), analysed, analysedAfterMs: performance.now() - uploadedAt };
}

async function main() {
  const build = spawnSync('bash', ['-c', 'source scripts/lib.sh && ensure_secret && ensure_build'], { cwd: ROOT, stdio: 'inherit' });
  if (build.status !== 0) throw new Error('next build failed');
  const secret = process.env.NEXTAUTH_SECRET ?? readFileSync(`${ROOT}.data/nextauth-secret`, 'utf8').trim();
  const dbEnv = { DB_NAME: DB, DB_HOST, DB_PORT, NODE_ENV: 'production', NEXTAUTH_SECRET: secret, NEXT_TELEMETRY_DISABLED: '1', DB_POOL_MAX: '10' };
  const storage = { S3_ENDPOINT: `http://127.0.0.1:${S3_PORT}`, S3_BUCKET: 'quietfix-bench', S3_FAKE_PORT: String(S3_PORT), S3_FAKE_DIR: `${ROOT}.data/s3-bench` };
  const appEnv = (port: number) => ({ ...dbEnv, ...storage, APP_URL: `http://127.0.0.1:${port}`, NEXTAUTH_URL: `http://127.0.0.1:${port}` });
  const serve = (port: number) => start(`app :${port}`, ['--import', 'tsx', 'scripts/serve.ts', '-p', String(port), '-H', '127.0.0.1'], appEnv(port));

  const client = scaleDb();
  await client.connect();
  const { rows } = await client.query("SELECT id, (SELECT count(*) FROM cases) AS cases, (SELECT count(*) FROM bearings) AS bearings FROM users WHERE email = 'coordinator@example.test'");
  await client.end();
  if (!rows.length) throw new Error(`no coordinator in ${DB}: run npm run seed:scale first`);
  console.log(`bench:api on ${DB}: ${rows[0].cases} cases, ${rows[0].bearings} bearings; ${CONNECTIONS} connections, ${SECONDS} s per run, loopback`);

  const minimal = start('minimal', ['--import', 'tsx', 'scripts/bench-minimal-server.ts', String(PORT_MIN), rows[0].id], dbEnv);
  const bare = start('minimal, no cache', ['--import', 'tsx', 'scripts/bench-minimal-server.ts', String(PORT_MIN + 1), rows[0].id], { ...dbEnv, MINIMAL_CACHE: '0' });
  const appA = serve(PORT_A);
  await Promise.all([waitHttp(`http://127.0.0.1:${PORT_A}/api/health`), waitHttp(`http://127.0.0.1:${PORT_MIN}/api/stats`), waitHttp(`http://127.0.0.1:${PORT_MIN + 1}/api/stats`)]);
  const cookie = await signIn(`http://127.0.0.1:${PORT_A}`);
  const one: Record<string, { app: Figures; minimal: Figures; bare: Figures }> = {};
  for (const s of SCENARIOS) {
    one[s.name] = {
      bare: await drive([`http://127.0.0.1:${PORT_MIN + 1}`], s.path, '', [bare.pid]),
      minimal: await drive([`http://127.0.0.1:${PORT_MIN}`], s.path, '', [minimal.pid]),
      app: await drive([`http://127.0.0.1:${PORT_A}`], s.path, cookie, [appA.pid]),
    };
  }
  // Two instances and two workers against the one PostgreSQL; the session made on A is used on both.
  const appB = serve(PORT_B);
  start('object store', ['--import', 'tsx', 'scripts/s3-fake.ts'], { ...storage, APP_URL: `http://127.0.0.1:${PORT_A}`, TRUSTED_ORIGINS: `http://127.0.0.1:${PORT_B}` });
  for (const w of [1, 2]) start(`worker ${w}`, ['--import', 'tsx', 'scripts/outbox-worker.ts'], { ...dbEnv, ...storage });
  await Promise.all([waitHttp(`http://127.0.0.1:${PORT_B}/api/health`), waitHttp(`${storage.S3_ENDPOINT}/`, 30)]);
  const two: Record<string, Figures> = {};
  for (const s of SCENARIOS) {
    two[s.name] = await drive([`http://127.0.0.1:${PORT_A}`, `http://127.0.0.1:${PORT_B}`], s.path, cookie, [appA.pid, appB.pid]);
  }

  const evidence = await uploadRound([`http://127.0.0.1:${PORT_A}`, `http://127.0.0.1:${PORT_B}`], cookie);

  const f = (x: Figures) =>
    `${x.rps.toFixed(0).padStart(6)} ${x.p50.toFixed(0).padStart(5)} ${x.p95.toFixed(0).padStart(5)} ${x.p99.toFixed(0).padStart(5)} ${x.cpuMs.toFixed(2).padStart(5)}${x.errors ? ` (${x.errors} errors)` : ''}`;
  const ratio = (a: Figures, b: Figures) => `${((100 * a.rps) / b.rps).toFixed(0).padStart(4)}%`;
  console.log('\nscenario                 | minimal, no cache req/s p50 p95 p99 cpu | minimal, same caches           | app, 1 instance                | ratio | ratio, no cache | app, 2 instances               | p95 target');
  for (const s of SCENARIOS) {
    const { app, minimal, bare } = one[s.name];
    console.log(
      `${s.name.padEnd(24)} | ${f(bare)} | ${f(minimal)} | ${f(app)} | ${ratio(app, minimal)} | ${ratio(app, bare)} | ${f(two[s.name])} | < ${s.targetP95} ms: 1 inst ${app.p95 < s.targetP95 ? 'met' : 'missed'}, 2 inst ${two[s.name].p95 < s.targetP95 ? 'met' : 'missed'}`,
    );
  }
  console.log(
    `\nevidence through both instances and one object store: ${UPLOADS} recordings of ${(evidence.bytes / 1024).toFixed(0)} kB (presign, PUT, complete; ${UPLOAD_PARALLEL} at a time): ` +
      `${evidence.perSecond.toFixed(1)} uploads/s, p50 ${evidence.p50.toFixed(0)} ms, p95 ${evidence.p95.toFixed(0)} ms; all ${evidence.analysed} analysed by the two workers ${(evidence.analysedAfterMs / 1000).toFixed(1)} s after the last upload`,
  );
  console.log(
    "\n(ratio: app requests/s over the minimal server's with the same caches (lists kept under the data revision, statistics 30 s); ratio, no cache: over the minimal server that runs every list's and the statistics' SQL on each request; cpu: the server processes' CPU ms per request)",
  );
}

main()
  .catch((err) => {
    console.error('bench:api failed:', err.message);
    process.exitCode = 1;
  })
  .finally(stopAll);
