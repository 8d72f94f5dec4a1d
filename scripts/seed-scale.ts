/**
 * npm run seed:scale — the 100,000-case club for the speed measurements (scripts/bench-api.ts).
 * Into the database SCALE_DB (default quietfix_scale) on the cluster DB_HOST/DB_PORT point at:
 * dropped and created anew, migrated, then filled with COPY: 100,000 cases, 1,000,000 bearings,
 * and people, timeline entries, fix snapshots and notices in proportion. All of it fiction: a made-up
 * club around the demo town, addresses under example.test, call signs starting with Q.
 * The coordinator signs in as coordinator@example.test with the demo password.
 */
import { randomUUID } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';

const SCALE_DB = process.env.SCALE_DB ?? 'quietfix_scale';
const CASES = Number(process.env.SCALE_CASES ?? 100_000);
const BEARINGS_PER_CASE = 10;
const DEMO_PASSWORD = 'quietfix-demo';

async function ensureDatabase() {
  const admin = new pg.Client({
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 54329),
    user: process.env.DB_USER ?? 'quietfix',
    password: process.env.DB_PASSWORD ?? 'quietfix-local',
    database: 'postgres',
  });
  await admin.connect();
  // Made anew each run: migrations give the schema and the default notice templates, the loader the rest.
  const name = `"${SCALE_DB.replace(/"/g, '')}"`;
  await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.end();
}

const csv = (v: unknown): string => {
  if (v === null || v === undefined) return '\\N';
  if (v instanceof Date) return v.toISOString();
  if (Array.isArray(v)) return `{${v.join(',')}}`;
  const s = String(v);
  return /[\t\n\\]/.test(s) ? s.replace(/\\/g, '\\\\').replace(/\t/g, '\\t').replace(/\n/g, '\\n') : s;
};

async function copyRows(client: pg.PoolClient, table: string, columns: string[], rows: Iterable<unknown[]>) {
  function* lines() {
    let buf: string[] = [];
    for (const r of rows) {
      buf.push(r.map(csv).join('\t'));
      if (buf.length >= 5000) {
        yield buf.join('\n') + '\n';
        buf = [];
      }
    }
    if (buf.length) yield buf.join('\n') + '\n';
  }
  await pipeline(Readable.from(lines()), client.query(copyFrom(`COPY ${table} (${columns.join(', ')}) FROM STDIN`)));
}

async function main() {
  const started = Date.now();
  await ensureDatabase();
  process.env.DB_NAME = SCALE_DB;
  const { db } = await import('../db/index');
  const { hashPassword } = await import('../lib/auth/password');
  const { DEMO_CENTRE } = await import('../db/seeds/demo');
  const { BANDS } = await import('../lib/hunt/bands');
  try {
    await db.migrate.latest();
    console.log(`quietfix: ${SCALE_DB} migrated (${((Date.now() - started) / 1000).toFixed(1)} s)`);
    await db('club_settings').insert({ id: 1, club_name: 'Quillon Radio Circle', contact_email: 'committee@example.test' }).onConflict('id').ignore();
    const hash = await hashPassword(DEMO_PASSWORD);
    const rand = Math.random; // fiction either way; a fresh club each run
    const pick = <T>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)];
    const now = Date.now();
    const DAY = 86_400_000;

    // People: one chair, 10 coordinators, 200 hunters, 5,000 members.
    type P = { id: string; email: string; name: string; call: string; role: string };
    const people: P[] = [];
    const add = (role: string, i: number, email?: string) =>
      people.push({ id: randomUUID(), email: email ?? `${role}${i}@example.test`, name: `${role[0].toUpperCase()}${role.slice(1)} ${i}`, call: `QS${i}${role[0].toUpperCase()}`, role });
    add('admin', 0, 'chair@example.test');
    for (let i = 0; i < 10; i++) add('coordinator', i, i === 0 ? 'coordinator@example.test' : undefined);
    for (let i = 0; i < 200; i++) add('hunter', i, i === 0 ? 'hunter@example.test' : undefined);
    for (let i = 0; i < 5000; i++) add('member', i, i === 0 ? 'member@example.test' : undefined);
    const hunters = people.filter((p) => p.role === 'hunter');
    const members = people.filter((p) => p.role === 'member');
    const committee = people.filter((p) => p.role === 'coordinator');

    const conn = (await db.client.acquireConnection()) as pg.PoolClient;
    try {
      // Bulk load: no per-row triggers (the loader writes the derived columns itself); constraints are checked by the schema.
      // One transaction: a failed load leaves the database (and its indexes) as they were.
      await conn.query('BEGIN');
      await conn.query('SET LOCAL session_replication_role = replica');
      await conn.query("SET LOCAL maintenance_work_mem = '256MB'");
      // Secondary indexes are dropped for the load and rebuilt from their own definitions afterwards (much faster).
      const { rows: indexes } = await conn.query<{ name: string; def: string }>(
        `SELECT i.indexname AS name, i.indexdef AS def FROM pg_indexes i
          WHERE i.schemaname = 'public' AND i.tablename IN ('cases', 'bearings', 'case_events', 'fix_snapshots', 'notices')
            AND NOT EXISTS (SELECT 1 FROM pg_constraint k WHERE k.conname = i.indexname)`,
      );
      for (const ix of indexes) await conn.query(`DROP INDEX "${ix.name}"`);
      await copyRows(conn, 'users', ['id', 'email', 'name', 'call_sign', 'role', 'password_hash'], people.map((p) => [p.id, p.email, p.name, p.call, p.role, hash]));

      const STATUS = ['open', 'located', 'notified', 'resolved'] as const;
      const OUTCOMES = ['fixed-by-owner', 'mitigated', 'utility-repaired', 'referred-to-regulator', 'stopped-on-its-own', 'not-found'];
      const WORDS = ['Rasping hash', 'Buzz', 'Wideband hiss', 'Clicks', 'Warbling carriers', 'Whine', 'Crackle', 'Hum'];
      type C = { id: string; status: string; created: Date; located: Date | null; notified: Date | null; resolved: Date | null; assignee: string | null; lat: number; lon: number; fixLat: number | null; fixLon: number | null; fixSize: number | null; notices: number; since: Date; activity: Date };
      const cases: C[] = [];
      const caseRows = function* () {
        for (let i = 0; i < CASES; i++) {
          const r = rand();
          const status = r < 0.3 ? 'open' : r < 0.45 ? 'located' : r < 0.6 ? 'notified' : 'resolved';
          const si = STATUS.indexOf(status);
          const created = new Date(now - Math.floor(rand() * 3 * 365 * DAY));
          const step = () => Math.floor((2 + rand() * 40) * DAY);
          const located = si >= 1 ? new Date(Math.min(now, created.getTime() + step())) : null;
          const notified = si >= 2 ? new Date(Math.min(now, (located as Date).getTime() + step())) : null;
          const resolved = si >= 3 ? new Date(Math.min(now, (notified as Date).getTime() + step())) : null;
          const since = resolved ?? notified ?? located ?? created;
          const activity = new Date(Math.min(now, since.getTime() + Math.floor(rand() * 5 * DAY)));
          const lat = DEMO_CENTRE.lat + (rand() - 0.5) * 0.5;
          const lon = DEMO_CENTRE.lon + (rand() - 0.5) * 0.6;
          const hasFix = si >= 1 || rand() < 0.5;
          const c: C = {
            id: randomUUID(), status, created, located, notified, resolved,
            assignee: rand() < 0.85 ? pick(hunters).id : null,
            lat, lon,
            fixLat: hasFix ? lat + (rand() - 0.5) * 0.004 : null,
            fixLon: hasFix ? lon + (rand() - 0.5) * 0.004 : null,
            fixSize: hasFix ? Math.round(20 + rand() * (si >= 1 ? 60 : 400)) : null,
            notices: si >= 2 ? 1 + Math.floor(rand() * 2) : 0,
            since, activity,
          };
          cases.push(c);
          const band = pick(BANDS).name;
          const before = si === 3 && rand() < 0.7 ? -95 + rand() * 20 : null;
          yield [
            c.id, `QF-${created.getUTCFullYear()}-${String(i + 1).padStart(6, '0')}`, `${pick(WORDS)} on ${band} near house ${i % 997}`,
            `Heard from the shack of member ${i % 5000}; reference Q${i}.`, status, pick(members).id, c.assignee, lat, lon,
            rand() < 0.3 ? [band, pick(BANDS).name] : [band], created, activity, '{}', si === 3 ? pick(OUTCOMES) : null,
            before, before === null ? null : before - 3 - rand() * 25, resolved, since, located, notified, activity,
            c.fixLat, c.fixLon, c.fixSize, c.notices,
          ];
        }
      };
      await copyRows(conn, 'cases', ['id', 'reference', 'title', 'description', 'status', 'reporter_id', 'assignee_id', 'reported_lat', 'reported_lon', 'bands', 'created_at', 'updated_at', 'report', 'outcome', 'level_before_dbm', 'level_after_dbm', 'resolved_at', 'status_since', 'located_at', 'notified_at', 'last_activity_at', 'fix_lat', 'fix_lon', 'fix_size_m', 'notice_count'], caseRows());
      await conn.query(`SELECT setval('case_reference_seq', ${CASES + 1})`);
      console.log(`quietfix: ${CASES} cases (${((Date.now() - started) / 1000).toFixed(1)} s)`);

      await copyRows(conn, 'bearings', ['case_id', 'author_id', 'lat', 'lon', 'position_source', 'azimuth_entered_deg', 'reference', 'declination_deg', 'azimuth_true_deg', 'sigma_deg', 'frequency_khz', 'taken_at', 'created_at', 'updated_at'], (function* () {
        for (const c of cases) {
          for (let k = 0; k < BEARINGS_PER_CASE; k++) {
            const az = Math.round(rand() * 3600) / 10;
            const t = new Date(c.created.getTime() + k * 3_600_000);
            yield [c.id, c.assignee, c.lat + (rand() - 0.5) * 0.02, c.lon + (rand() - 0.5) * 0.02, 'device', az, 'true', 0, az, 3 + rand() * 5, 3500 + Math.round(rand() * 4000), t, t, t];
          }
        }
      })());
      console.log(`quietfix: ${CASES * BEARINGS_PER_CASE} bearings (${((Date.now() - started) / 1000).toFixed(1)} s)`);

      await copyRows(conn, 'case_events', ['case_id', 'actor_id', 'kind', 'data', 'visibility', 'created_at'], (function* () {
        for (const c of cases) {
          yield [c.id, null, 'reported', '{}', 'all', c.created];
          if (c.assignee) yield [c.id, committee[0].id, 'assigned', JSON.stringify({ assigneeId: c.assignee }), 'committee', c.created];
          for (const [to, at] of [['located', c.located], ['notified', c.notified], ['resolved', c.resolved]] as const) {
            if (at) yield [c.id, committee[0].id, 'status-changed', JSON.stringify({ to }), 'all', at];
          }
        }
      })());
      await copyRows(conn, 'fix_snapshots', ['case_id', 'cause', 'line_count', 'ok', 'lat', 'lon', 'semi_major_m', 'semi_minor_m', 'major_axis_azimuth_deg', 'result', 'created_at'], (function* () {
        for (const c of cases) if (c.fixLat !== null) yield [c.id, 'bearing-added', BEARINGS_PER_CASE, true, c.fixLat, c.fixLon, c.fixSize, (c.fixSize ?? 0) / 2, 30, '{}', c.activity];
      })());
      let n = 0;
      // reminder_checked_at: the reminder sweep has already looked at these (as it would have, day by day).
      await copyRows(conn, 'notices', ['case_id', 'template_key', 'status', 'recipient_name', 'postal_address', 'address_key', 'email', 'sent_at', 'created_at', 'updated_at', 'reminder_checked_at'], (function* () {
        for (const c of cases) {
          for (let k = 0; k < c.notices; k++) {
            n++;
            const at = c.notified ?? c.created;
            yield [c.id, k === 0 ? 'first-notice' : 'follow-up', 'sent', `Householder ${n}`, `${n % 300} Quill Lane, Quillon`, `${n} quill lane quillon ${k}`, `house${n}@example.test`, at, at, at, at];
          }
        }
      })());
      console.log(`quietfix: people, timeline, fixes, ${n} notices (${((Date.now() - started) / 1000).toFixed(1)} s)`);
      for (const ix of indexes) await conn.query(ix.def);
      console.log(`quietfix: ${indexes.length} indexes rebuilt (${((Date.now() - started) / 1000).toFixed(1)} s)`);
      await conn.query('COMMIT');
    } catch (err) {
      await conn.query('ROLLBACK');
      throw err;
    } finally {
      await db.client.releaseConnection(conn);
    }
    await db.raw('VACUUM ANALYZE');
    console.log(`quietfix: ${SCALE_DB} ready in ${((Date.now() - started) / 1000).toFixed(1)} s; sign in as coordinator@example.test / ${DEMO_PASSWORD}`);
  } finally {
    await db.destroy();
  }
}

main().catch((err) => {
  console.error('quietfix: seed:scale failed:', err.message);
  process.exitCode = 1;
});
