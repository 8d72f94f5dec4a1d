import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { db } from '@/db';
import { api, BASE_URL, signIn, type Session } from '../support/http';

/**
 * The committee's queue against SQL written here, independently of db/queue.ts: every sort key in
 * both directions walked page by page with the keyset cursor, ?page=N, the filters, the capped count,
 * keyset stability while rows are added, and the visibility rule for a hunter.
 */
const TAG = `qtag${Date.now().toString(36)}`;
const N = 57;
let coordinator: Session;
let hunter: Session;
let hunterId: string;
let memberId: string;
const BANDS = ['80m', '40m', '20m', '160m'];
const STATUSES = ['open', 'located', 'notified', 'resolved'];
const DAY = 86_400_000;

async function ids(sql: string, bindings: string[] = []): Promise<string[]> {
  return (await db.raw(sql, bindings)).rows.map((r: { id: string }) => r.id);
}

async function walk(query: string, session = coordinator, pageSize = 7): Promise<string[]> {
  const out: string[] = [];
  let cursor: string | null = null;
  for (let guard = 0; guard < 100; guard++) {
    const r = await api(`/api/cases?${query}&pageSize=${pageSize}${cursor ? `&cursor=${cursor}` : ''}`, { session });
    expect(r.status, r.text).toBe(200);
    out.push(...r.json.items.map((i: { id: string }) => i.id));
    cursor = r.json.nextCursor;
    if (!cursor) return out;
  }
  throw new Error('cursor never ended');
}

beforeAll(async () => {
  coordinator = await signIn('coordinator@example.test');
  hunter = await signIn('hunter@example.test');
  hunterId = (await db('users').where({ email: 'hunter@example.test' }).first()).id;
  memberId = (await db('users').where({ email: 'member@example.test' }).first()).id;
  const base = Date.now() - 400 * DAY;
  const rows = Array.from({ length: N }, (_, i) => ({
    id: randomUUID(),
    reference: `QT-${TAG}-${String(i).padStart(3, '0')}`,
    title: `${TAG} case ${i}`,
    status: STATUSES[i % 4],
    reporter_id: memberId,
    assignee_id: i % 3 === 0 ? null : i % 3 === 1 ? hunterId : (undefined as unknown as string),
    reported_lat: -31.05 + (i % 10) * 0.001,
    reported_lon: 129.75 + Math.floor(i / 10) * 0.001,
    bands: [BANDS[i % 4], ...(i % 5 === 0 ? ['2m'] : [])],
    // groups of three share a timestamp, so the id tie-breaker matters
    last_activity_at: new Date(base + Math.floor(i / 3) * DAY),
    status_since: new Date(base + ((i * 7) % N) * DAY),
    fix_size_m: i % 4 === 0 ? null : 20 + ((i * 13) % 50),
    notice_count: i % 3,
    level_before_dbm: i % 4 === 3 ? -90 + (i % 7) : null,
    level_after_dbm: i % 4 === 3 ? -100 - (i % 5) : null,
    outcome: i % 4 === 3 ? 'fixed-by-owner' : null,
    created_at: new Date(base - 10 * DAY + i * DAY),
    resolved_at: i % 4 === 3 ? new Date(base + 5 * DAY + i * 2 * DAY) : null,
  }));
  const other = await db('users').where({ email: 'coordinator@example.test' }).first();
  for (const r of rows) if (r.assignee_id === undefined) r.assignee_id = other.id;
  await db('cases').insert(rows);
});

afterAll(async () => {
  await db('cases').where('title', 'like', `${TAG}%`).delete();
});

const mine = `title LIKE '${'$TAG'}%'`;
const where = () => mine.replace('$TAG', TAG);

describe('queue sorting with keyset pages matches SQL written independently', () => {
  const EXPECTED: Record<string, Record<'asc' | 'desc', string>> = {
    reference: { asc: 'reference ASC, id ASC', desc: 'reference DESC, id DESC' },
    status: {
      asc: "CASE status WHEN 'open' THEN 1 WHEN 'located' THEN 2 WHEN 'notified' THEN 3 ELSE 4 END ASC, id ASC",
      desc: "CASE status WHEN 'open' THEN 1 WHEN 'located' THEN 2 WHEN 'notified' THEN 3 ELSE 4 END DESC, id DESC",
    },
    // "days in state" descending = longest in its state first = the earliest status_since first
    stateAge: { desc: 'status_since ASC, id ASC', asc: 'status_since DESC, id DESC' },
    band: { asc: "coalesce(bands[1], '') ASC, id ASC", desc: "coalesce(bands[1], '') DESC, id DESC" },
    hunter: {
      asc: "coalesce(lower((SELECT name FROM users u WHERE u.id = cases.assignee_id)), '') ASC, id ASC",
      desc: "coalesce(lower((SELECT name FROM users u WHERE u.id = cases.assignee_id)), '') DESC, id DESC",
    },
    lastActivity: { asc: 'last_activity_at ASC, id ASC', desc: 'last_activity_at DESC, id DESC' },
    // cases without a fix come after every size when ascending
    fixSize: { asc: 'fix_size_m ASC NULLS LAST, id ASC', desc: 'fix_size_m DESC NULLS FIRST, id DESC' },
    notices: { asc: 'notice_count ASC, id ASC', desc: 'notice_count DESC, id DESC' },
  };
  for (const [sort, dirs] of Object.entries(EXPECTED)) {
    for (const dir of ['asc', 'desc'] as const) {
      it(`${sort} ${dir}`, async () => {
        const expected = await ids(`SELECT id FROM cases WHERE ${where()} ORDER BY ${dirs[dir]}`);
        expect(expected).toHaveLength(N);
        expect(await walk(`q=${TAG}&sort=${sort}&dir=${dir}`)).toEqual(expected);
      });
    }
  }

  it('?page=N answers the same rows as OFFSET in SQL, and the capped total is exact below the cap', async () => {
    const expected = await ids(`SELECT id FROM cases WHERE ${where()} ORDER BY reference ASC LIMIT 10 OFFSET 20`);
    const r = await api(`/api/cases?q=${TAG}&sort=reference&dir=asc&page=3&pageSize=10`, { session: coordinator });
    expect(r.json.items.map((i: { id: string }) => i.id)).toEqual(expected);
    expect(r.json).toMatchObject({ total: N, totalCapped: false, page: 3, pageSize: 10 });
  });
});

describe('queue filters match SQL', () => {
  const area = '129.7495,-31.0505,129.7525,-31.0455';
  const CASES: [string, string][] = [
    ['status=open,located', "status IN ('open','located')"],
    ['assigneeId=none', 'assignee_id IS NULL'],
    ['band=2m', "'2m' = ANY(bands)"],
    ['minDays=200', "status_since <= now() - interval '200 days'"],
    [`area=${area}`, 'reported_lon BETWEEN 129.7495 AND 129.7525 AND reported_lat BETWEEN -31.0505 AND -31.0455'],
    ['status=resolved&band=160m', "status = 'resolved' AND '160m' = ANY(bands)"],
  ];
  it.each(CASES)('%s', async (query, sql) => {
    const expected = await ids(`SELECT id FROM cases WHERE ${where()} AND ${sql} ORDER BY last_activity_at DESC, id DESC`);
    expect(expected.length).toBeGreaterThan(0);
    expect(await walk(`q=${TAG}&${query}`)).toEqual(expected);
  });

  it('bad areas are a 400 that says what is wrong', async () => {
    const many = Array.from({ length: 51 }, (_, k) => `${(129 + Math.cos((2 * Math.PI * k) / 51) / 100).toFixed(5)},${(-31 + Math.sin((2 * Math.PI * k) / 51) / 100).toFixed(5)}`).join(';');
    const BAD: [string, RegExp][] = [
      ['129.75,-31.05;129.76,-31.04;129.76,-31.05;129.75,-31.04', /crosses itself/], // a bow tie
      ['129.75,-31.05;129.76,-31.04', /at least 3/],
      [many, /at most 50/],
      ['129.75,-95;129.76,-31.04;129.76,-31.05', /off the globe/],
      ['129.75,-31.05;129.76,-31.04;129.77,-31.03', /no ground/], // three points on one line
      ['129.75,abc;129.76,-31.04;129.76,-31.05', /not lon,lat/],
      ['129.75,-31.05;129.76,-31.04;129.76,-31.04;129.76,-31.05', /twice in a row/],
    ];
    for (const [area, message] of BAD) {
      const r = await api(`/api/cases?area=${encodeURIComponent(area)}`, { session: coordinator });
      expect(r.status, area).toBe(400);
      expect(r.json.issues[0].message, area).toMatch(message);
      expect((await api(`/api/cases/map?bbox=129,-32,130,-30&zoom=10&area=${encodeURIComponent(area)}`, { session: coordinator })).status).toBe(400);
    }
  });

  it('the text search finds a reference, any case', async () => {
    const r = await api(`/api/cases?q=${`qt-${TAG}-01`.toUpperCase()}`, { session: coordinator });
    expect(r.json.items.map((i: { reference: string }) => i.reference).sort()).toEqual(Array.from({ length: 10 }, (_, k) => `QT-${TAG}-01${k}`));
  });

  it('bad filters are a 400 with the field named, never a 500', async () => {
    for (const q of ['status=lost', 'area=1,2,3', 'area=10,0,5,1', 'sort=colour', 'minDays=-1', 'cursor=bm90LWEtY3Vyc29y', 'assigneeId=someone']) {
      const r = await api(`/api/cases?${q}`, { session: coordinator });
      expect(r.status, q).toBe(400);
      expect(typeof r.json.error).toBe('string');
    }
  });

  it('a hunter sees exactly the cases assigned to them (or reported by them)', async () => {
    const expected = await ids(`SELECT id FROM cases WHERE ${where()} AND (assignee_id = ? OR reporter_id = ?) ORDER BY last_activity_at DESC, id DESC`, [hunterId, hunterId]);
    expect(expected.length).toBeGreaterThan(0);
    expect(await walk(`q=${TAG}`, hunter)).toEqual(expected);
  });
});

describe('an area drawn on the map (a polygon) filters the queue, the map and the export like PostGIS ST_Contains in SQL written here', () => {
  // Vertices fall between the grid's points (0.001° apart), so no case lies on an edge.
  const SHAPES: [string, [number, number][]][] = [
    ['a triangle', [[129.7497, -31.0503], [129.7553, -31.0503], [129.7497, -31.0417]]],
    ['a concave notch', [[129.7495, -31.0505], [129.7555, -31.0505], [129.7555, -31.0405], [129.7525, -31.0455], [129.7495, -31.0405]]],
    ['a closed ring given with its first point again', [[129.7515, -31.0485], [129.7545, -31.0485], [129.7545, -31.0445], [129.7515, -31.0445], [129.7515, -31.0485]]],
  ];
  it.each(SHAPES)('%s', async (_name, vertices) => {
    const wkt = `POLYGON((${[...vertices, vertices[0]].map(([lon, lat]) => `${lon} ${lat}`).join(', ')}))`;
    const expected = await ids(
      `SELECT id FROM cases WHERE ${where()} AND ST_Contains(ST_GeomFromText(?, 4326), ST_SetSRID(ST_MakePoint(reported_lon, reported_lat), 4326)) ORDER BY last_activity_at DESC, id DESC`,
      [wkt],
    );
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.length).toBeLessThan(N);
    const area = encodeURIComponent(vertices.map(([lon, lat]) => `${lon},${lat}`).join(';'));
    expect(await walk(`q=${TAG}&area=${area}`)).toEqual(expected);
    const map = await api(`/api/cases/map?bbox=129.70,-31.10,129.80,-31.00&zoom=19&q=${TAG}&area=${area}`, { session: coordinator });
    expect(map.status, map.text).toBe(200);
    expect(map.json.cells.reduce((n: number, c: { count: number }) => n + c.count, 0)).toBe(expected.length);
    const csv = await fetch(`${BASE_URL}/api/cases/export?format=csv&q=${TAG}&area=${area}`, { headers: { cookie: coordinator.cookie } });
    const refs = (await csv.text()).trim().split('\n').slice(1).map((l) => l.split(',')[0]);
    const expectedRefs = (await db.raw(`SELECT reference FROM cases WHERE id = ANY(?) ORDER BY reference`, [expected])).rows.map((r: { reference: string }) => r.reference);
    expect(refs).toEqual(expectedRefs);
  });
});

describe('keyset pages stay stable while rows change', () => {
  it('new cases on top and a changed row do not repeat or skip rows of the next page', async () => {
    const before = await ids(`SELECT id FROM cases WHERE ${where()} ORDER BY last_activity_at DESC, id DESC`);
    const first = await api(`/api/cases?q=${TAG}&pageSize=10`, { session: coordinator });
    expect(first.json.items.map((i: { id: string }) => i.id)).toEqual(before.slice(0, 10));
    // Three new cases become the most recent, and a case from further down is touched back in time.
    const fresh = [0, 1, 2].map((k) => ({ id: randomUUID(), reference: `QT-${TAG}-new${k}`, title: `${TAG} new ${k}`, reporter_id: memberId, bands: ['80m'] }));
    await db('cases').insert(fresh);
    await db('cases').where({ id: before[30] }).update({ last_activity_at: new Date(Date.now() - 1000 * DAY) });
    const second = await api(`/api/cases?q=${TAG}&pageSize=10&cursor=${first.json.nextCursor}`, { session: coordinator });
    expect(second.json.items.map((i: { id: string }) => i.id)).toEqual(before.slice(10, 20));
    // OFFSET would have shown three rows of the first page again.
    const offset = await api(`/api/cases?q=${TAG}&pageSize=10&page=2`, { session: coordinator });
    expect(offset.json.items.map((i: { id: string }) => i.id).slice(0, 3)).toEqual(before.slice(7, 10));
    await db('cases').whereIn('id', fresh.map((f) => f.id)).delete();
  });
});

describe('the count stops at 10,000', () => {
  const BIG = `${TAG}big`;
  afterAll(async () => {
    await db('cases').where('title', 'like', `${BIG}%`).delete();
  });
  it('answers 10,000 and totalCapped beyond it', async () => {
    await db.raw(
      `INSERT INTO cases (reference, title, reporter_id, bands) SELECT 'QT-' || ? || '-' || g, ? || ' ' || g, ?, '{}' FROM generate_series(1, 10005) g`,
      [BIG, BIG, memberId],
    );
    const r = await api(`/api/cases?q=${BIG}`, { session: coordinator });
    expect(r.json).toMatchObject({ total: 10_000, totalCapped: true });
    expect(r.json.items).toHaveLength(25);
  });
});

describe('bulk assignment', () => {
  it('assigns several cases in one go, with a timeline entry each', async () => {
    const some = await ids(`SELECT id FROM cases WHERE ${where()} AND assignee_id IS NULL ORDER BY id LIMIT 3`);
    const r = await api('/api/cases/bulk-assign', { session: coordinator, body: { caseIds: some, assigneeId: hunterId } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.changed).toBe(3);
    expect(await db('cases').whereIn('id', some).where({ assignee_id: hunterId }).count<{ count: string }[]>({ count: '*' })).toEqual([{ count: '3' }]);
    expect((await db('case_events').whereIn('case_id', some).where({ kind: 'assigned' })).length).toBe(3);
  });
  it('an unknown case in the list assigns none of them', async () => {
    const some = await ids(`SELECT id FROM cases WHERE ${where()} AND assignee_id IS NULL ORDER BY id LIMIT 2`);
    const r = await api('/api/cases/bulk-assign', { session: coordinator, body: { caseIds: [...some, randomUUID()], assigneeId: hunterId } });
    expect(r.status).toBe(404);
    expect(await db('cases').whereIn('id', some).whereNotNull('assignee_id')).toHaveLength(0);
  });
  it('refuses a member as the assignee', async () => {
    const some = await ids(`SELECT id FROM cases WHERE ${where()} ORDER BY id LIMIT 1`);
    const r = await api('/api/cases/bulk-assign', { session: coordinator, body: { caseIds: some, assigneeId: memberId } });
    expect(r.status).toBe(400);
  });
});

describe('saved views', () => {
  it('saves, lists, refuses a broken view and removes only its owner\'s', async () => {
    const name = `${TAG} open by age`;
    const saved = await api('/api/saved-filters', { session: coordinator, body: { name, query: 'status=open&sort=stateAge&dir=desc&cursor=x' } });
    expect(saved.status, saved.text).toBe(201);
    expect(saved.json.query).toBe('status=open&sort=stateAge&dir=desc');
    expect((await api('/api/saved-filters', { session: coordinator })).json.items.map((i: { name: string }) => i.name)).toContain(name);
    expect((await api('/api/saved-filters', { session: coordinator, body: { name: 'broken', query: 'status=lost' } })).status).toBe(400);
    expect((await api(`/api/saved-filters/${saved.json.id}`, { method: 'DELETE', session: hunter })).status).toBe(404);
    expect((await api(`/api/saved-filters/${saved.json.id}`, { method: 'DELETE', session: coordinator })).status).toBe(200);
    expect((await api(`/api/saved-filters/${saved.json.id}`, { method: 'DELETE', session: coordinator })).status).toBe(404);
  });
});

describe('the map of all cases', () => {
  const bbox = '129.70,-31.10,129.80,-31.00';
  it('clusters add up to the filtered cases in the box, at any zoom', async () => {
    const [{ n }] = (await db.raw(`SELECT count(*)::int AS n FROM cases WHERE ${where()}`)).rows;
    for (const zoom of [10, 14, 19]) {
      const r = await api(`/api/cases/map?bbox=${bbox}&zoom=${zoom}&q=${TAG}`, { session: coordinator });
      expect(r.status, r.text).toBe(200);
      expect(r.json.cells.reduce((s: number, c: { count: number }) => s + c.count, 0)).toBe(n);
    }
    // At street zoom the cases of the test sit 100 m apart: every one is its own point, with its status.
    const fine = await api(`/api/cases/map?bbox=${bbox}&zoom=19&q=${TAG}&status=resolved`, { session: coordinator });
    const expected = await ids(`SELECT id FROM cases WHERE ${where()} AND status = 'resolved' ORDER BY id`);
    expect(fine.json.cells.map((c: { case: { id: string } }) => c.case.id).sort()).toEqual(expected);
    expect(fine.json.cells.every((c: { case: { status: string } }) => c.case.status === 'resolved')).toBe(true);
  });
  it('the heat view counts open cases only', async () => {
    const [{ n }] = (await db.raw(`SELECT count(*)::int AS n FROM cases WHERE ${where()} AND status = 'open'`)).rows;
    const r = await api(`/api/cases/map?bbox=${bbox}&zoom=12&heat=1&q=${TAG}`, { session: coordinator });
    expect(r.json.cells.reduce((s: number, c: { count: number }) => s + c.count, 0)).toBe(n);
  });
  it('a box must be west,south,east,north', async () => {
    expect((await api('/api/cases/map?bbox=1,2,3&zoom=3', { session: coordinator })).status).toBe(400);
    expect((await api('/api/cases/map?bbox=1,2,3,4&zoom=99', { session: coordinator })).status).toBe(400);
  });
});

describe('statistics', () => {
  const median = (xs: number[]) => {
    const s = [...xs].sort((a, b) => a - b);
    const m = (s.length - 1) / 2;
    return (s[Math.floor(m)] + s[Math.ceil(m)]) / 2;
  };
  it('totals, outcomes, median days and the noise reduction agree with the rows', async () => {
    const rows = await db('cases').where('title', 'like', `${TAG} case%`);
    const r = await api(`/api/stats?q=${encodeURIComponent(`${TAG} case`)}`, { session: coordinator });
    expect(r.status, r.text).toBe(200);
    expect(r.json.totals.cases).toBe(rows.length);
    expect(r.json.totals.resolved).toBe(rows.filter((x) => x.status === 'resolved').length);
    expect(r.json.outcomes.find((o: { outcome: string }) => o.outcome === 'fixed-by-owner').count).toBe(rows.filter((x) => x.outcome === 'fixed-by-owner').length);
    const measured = rows.filter((x) => x.level_before_dbm !== null && x.level_after_dbm !== null);
    expect(r.json.noiseReduction.measured).toBe(measured.length);
    expect(r.json.noiseReduction.medianDb).toBeCloseTo(median(measured.map((x) => x.level_before_dbm - x.level_after_dbm)), 1);
    const resolvedDays = rows.filter((x) => x.resolved_at).map((x) => (x.resolved_at.getTime() - x.created_at.getTime()) / DAY);
    expect(r.json.medianDays.reportToResolved).toBeCloseTo(median(resolvedDays), 1);
    // The last week's standing counts every case once.
    const last = r.json.overTime.at(-1);
    expect(last.open + last.located + last.notified + last.resolved).toBe(rows.length);
    const load = r.json.load.find((l: { hunterId: string }) => l.hunterId === hunterId);
    expect(load.total).toBe(rows.filter((x) => x.assignee_id === hunterId && x.status !== 'resolved').length);
  });
});
