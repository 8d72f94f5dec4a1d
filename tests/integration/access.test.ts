import { beforeAll, describe, expect, it } from 'vitest';
import { api, APP_ORIGIN, BASE_URL, DEMO_PASSWORD, signIn, type Session } from '../support/http';
import { dbState } from '../support/db-state';
import { ACCESS, type Who } from './access-matrix';

const WHO: Who[] = ['anon', 'admin', 'coordinator', 'hunter', 'member'];
const EMAIL: Record<Exclude<Who, 'anon'>, string> = {
  admin: 'chair@example.test',
  coordinator: 'coordinator@example.test',
  hunter: 'hunter@example.test',
  member: 'member@example.test',
};

const sessions: Partial<Record<Who, Session>> = {};
const ids: Record<string, string> = {};

beforeAll(async () => {
  for (const who of WHO) if (who !== 'anon') sessions[who] = await signIn(EMAIL[who]);
  for (const who of WHO) {
    if (who === 'anon') continue;
    ids[who] = (await api('/api/auth/session', { session: sessions[who] })).json.user.id;
  }
  const open = await api('/api/cases?q=Rasping', { session: sessions.admin });
  ids.openCase = open.json.items[0].id;
  ids.openBearing = (await api(`/api/cases/${ids.openCase}/bearings`, { session: sessions.admin })).json.items[0].id;
  ids.locatedCase = (await api('/api/cases?q=Warbling', { session: sessions.admin })).json.items[0].id;
  ids.noticeAddress = `1 Matrix Row, Quillon ${Date.now()}`;
  const draft = await api(`/api/cases/${ids.locatedCase}/notices`, {
    session: sessions.coordinator,
    body: { templateKey: 'first-notice', recipientName: 'Matrix household', postalAddress: ids.noticeAddress },
  });
  ids.notice = draft.json.notice.id;
  // The same household on a located case the hunter is not assigned to: the "same address elsewhere" warning must not tell them.
  ids.otherLocatedCase = await locatedCaseOf(sessions.coordinator!);
  const other = await api(`/api/cases/${ids.otherLocatedCase}/notices`, {
    session: sessions.coordinator,
    body: { templateKey: 'first-notice', recipientName: 'Matrix household', postalAddress: ids.noticeAddress },
  });
  expect(other.status, other.text).toBe(201);
  // The committee is warned about it from the matrix's case: so there is something a hunter must not learn.
  const warned = await api(`/api/cases/${ids.locatedCase}/notices?address=${encodeURIComponent(ids.noticeAddress)}`, { session: sessions.coordinator });
  expect(warned.json.sameAddressElsewhere.map((x: { caseId: string }) => x.caseId)).toContain(ids.otherLocatedCase);
});

/** A fresh unassigned case, located by a coordinator on confirmed premises. */
async function locatedCaseOf(s: Session): Promise<string> {
  const filed = await api('/api/cases', {
    session: s,
    body: {
      title: 'Matrix neighbour case',
      sound: 'buzz',
      soundNote: '',
      description: 'A second case for the access matrix.',
      frequencies: [{ value: 3.6, unit: 'MHz' }],
      schedule: { days: ['tue'], pattern: 'continuous', note: '' },
      position: { lat: -31.42, lon: 129.31 + (Date.now() % 1000) / 1e5, source: 'map' },
      consentShareName: false,
    },
  });
  expect(filed.status, filed.text).toBe(201);
  const id = filed.json.case.id;
  await api(`/api/cases/${id}/comments`, { session: s, body: { text: 'Premises confirmed.', premisesConfirmed: true } });
  const version = (await api(`/api/cases/${id}`, { session: s })).json.version;
  const t = await api(`/api/cases/${id}/transitions`, { session: s, body: { to: 'located', version, evidence: 'premises' } });
  expect(t.status, t.text).toBe(200);
  return id;
}

/** Every key of a JSON value, at any depth. */
function keysOf(v: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(v)) v.forEach((x) => keysOf(x, out));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) keysOf(x, out.add(k));
  return out;
}

describe('access matrix (401 signed out, 403 wrong role, JSON always)', () => {
  const cases = ACCESS.flatMap((row) => WHO.map((who) => ({ row, who })));
  it.each(cases.map((c) => [`${c.row.method} ${c.row.name} as ${c.who} -> ${c.row.expect[c.who]}`, c] as const))('%s', async (_label, { row, who }) => {
    const r = await api(row.path(ids), { method: row.method, body: row.body?.(who), session: sessions[who], headers: row.rawBody ? { 'content-type': 'text/csv' } : undefined });
    expect(r.status, r.text.slice(0, 300)).toBe(row.expect[who]);
    expect(r.headers.get('content-type')).toMatch(row.contentType && r.status < 400 ? row.contentType : /application\/json/);
    if (r.status >= 400) expect(typeof r.json.error).toBe('string');
    if (row.hidden?.from.includes(who)) {
      const keys = keysOf(r.json);
      for (const k of row.hidden.keys) expect(keys.has(k), `${k} in ${r.text.slice(0, 300)}`).toBe(false);
      expect(r.text).not.toContain(ids.noticeAddress);
      expect(r.text).not.toContain(ids.otherLocatedCase);
    }
  });
});

/**
 * Every state-changing row of the matrix (and next-auth's own POSTs), as a signed-in admin, from
 * places that are not the app: refused before anything runs, and nothing written.
 */
describe('cross-site and non-JSON state changes are refused (403 / 415)', () => {
  const APP = new URL(APP_ORIGIN);
  const OTHER_PORT = `${APP.protocol}//${APP.hostname}:${Number(APP.port || 80) + 1}`;
  const AUTH_POSTS = [
    { name: 'next-auth sign-in', method: 'POST', path: () => '/api/auth/callback/credentials' },
    { name: 'next-auth sign-out', method: 'POST', path: () => '/api/auth/signout' },
  ];
  const rows = [...ACCESS.filter((r) => r.method !== 'GET'), ...AUTH_POSTS];
  const ATTEMPTS: { label: string; headers: Record<string, string>; status: number }[] = [
    { label: 'from another site', headers: { origin: 'https://elsewhere.example.test' }, status: 403 },
    { label: 'from another port of this host', headers: { origin: OTHER_PORT }, status: 403 },
    { label: 'with Origin "null" (sandboxed page)', headers: { origin: 'null' }, status: 403 },
    { label: 'with only a foreign Referer', headers: { referer: 'https://elsewhere.example.test/page' }, status: 403 },
    { label: 'with neither Origin nor Referer', headers: {}, status: 403 },
  ];
  let before: Awaited<ReturnType<typeof dbState>>;
  const watched = () => ({ cases: [ids.openCase, ids.locatedCase], bearings: [ids.openBearing], notices: [ids.notice], users: [ids.member] });
  beforeAll(async () => {
    before = await dbState(watched());
  });

  // next-auth's POSTs carry its own CSRF token: a script with no Origin at all goes on to that check (below).
  const table = rows.flatMap((row) => ATTEMPTS.filter((a) => !(AUTH_POSTS.some((p) => p.name === row.name) && Object.keys(a.headers).length === 0)).map((a) => ({ row, a })));
  it.each(table.map((t) => [`${t.row.method} ${t.row.name} ${t.a.label} -> ${t.a.status}`, t] as const))('%s', async (_label, { row, a }) => {
    // Raw fetch: the test client would add the app's Origin.
    const body = 'body' in row && row.body ? JSON.stringify(row.body('admin')) : '{}';
    const res = await fetch(`${BASE_URL}${row.path(ids)}`, {
      method: row.method,
      redirect: 'manual',
      headers: { 'content-type': 'application/json', cookie: sessions.admin!.cookie, ...a.headers },
      body,
    });
    expect(res.status).toBe(a.status);
    const j = await res.json();
    expect(j.error).toMatch(/refused/);
  });

  // A route that reads a CSV body (rawBody) takes text of any type: the Origin check above is what refuses a cross-site post to it.
  const jsonRows = rows.filter((row) => !('rawBody' in row && row.rawBody));
  it.each(jsonRows.map((row) => [`${row.method} ${row.name} sent as text/plain from the app -> 415`, row] as const))('%s', async (_label, row) => {
    const body = 'body' in row && row.body ? JSON.stringify(row.body('admin')) : '{}';
    const isAuth = row.path(ids).startsWith('/api/auth/');
    const r = await api(row.path(ids), { method: row.method, session: sessions.admin, body, headers: { 'content-type': 'text/plain;charset=UTF-8' } });
    expect(r.status, r.text.slice(0, 200)).toBe(415);
    expect(r.json.error).toMatch(isAuth ? /form/ : /JSON/);
  });

  it('accepts a same-site Referer when a client sends no Origin (passes the check, then validation answers)', async () => {
    const res = await fetch(`${BASE_URL}/api/cases/${ids.openCase}/comments`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie: sessions.admin!.cookie, referer: `${APP_ORIGIN}/cases/${ids.openCase}` },
      body: JSON.stringify({ text: '' }),
    });
    expect(res.status).toBe(400);
  });

  it("next-auth without any Origin: its own CSRF token decides (missing token: no session; right token: signed in, as curl does)", async () => {
    const form = (extra: Record<string, string>) => new URLSearchParams({ email: 'member@example.test', password: DEMO_PASSWORD, json: 'true', ...extra });
    const noToken = await fetch(`${BASE_URL}/api/auth/callback/credentials`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: form({}) });
    expect(noToken.headers.getSetCookie().some((c) => c.includes('session-token'))).toBe(false);
    const csrfRes = await fetch(`${BASE_URL}/api/auth/csrf`);
    const cookie = csrfRes.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const { csrfToken } = await csrfRes.json();
    const withToken = await fetch(`${BASE_URL}/api/auth/callback/credentials`, { method: 'POST', redirect: 'manual', headers: { 'content-type': 'application/x-www-form-urlencoded', cookie }, body: form({ csrfToken }) });
    expect(withToken.headers.getSetCookie().some((c) => c.includes('session-token'))).toBe(true);
  });

  it('refuses a page POST (a server action) from another site or without an Origin, before Next runs it', async () => {
    for (const headers of [{ origin: 'https://elsewhere.example.test' }, {}] as Record<string, string>[]) {
      const res = await fetch(`${BASE_URL}/cases`, { method: 'POST', redirect: 'manual', headers: { 'next-action': 'made-up', cookie: sessions.admin!.cookie, ...headers } });
      expect(res.status).toBe(403);
      expect((await res.json()).error).toMatch(/refused/);
    }
  });

  it('wrote nothing', async () => {
    expect(await dbState(watched())).toEqual(before);
  });
});

describe('signed-out page visits', () => {
  it('redirect to sign-in and remember where to come back', async () => {
    const r = await api('/cases?status=open');
    expect([302, 307]).toContain(r.status);
    const loc = new URL(r.headers.get('location')!, 'http://x');
    expect(loc.pathname).toBe('/sign-in');
    expect(loc.searchParams.get('next')).toBe('/cases?status=open');
  });
});

describe('list endpoints', () => {
  it('answer {items,total,page,pageSize} and cap pageSize', async () => {
    const r = await api('/api/cases?page=1&pageSize=5000', { session: sessions.admin });
    expect(r.status).toBe(200);
    // the list shape, plus the queue's keyset cursor, capped-count flag and sort
    expect(Object.keys(r.json).sort()).toEqual(['dir', 'items', 'nextCursor', 'page', 'pageSize', 'sort', 'total', 'totalCapped']);
    expect(r.json.pageSize).toBe(100);
    expect(r.json.total).toBeGreaterThanOrEqual(3);
  });
  it('show members only their own reports and hunters only their assignments, without positions', async () => {
    const member = await api('/api/cases', { session: sessions.member });
    expect(member.json.items.length).toBeGreaterThan(0);
    for (const c of member.json.items) expect(c).not.toHaveProperty('reportedLat');
    const bad = await api('/api/cases?page=0', { session: sessions.admin });
    expect(bad.status).toBe(400);
  });
  it('list what the case page opens, by the same rule: a hunter sees the case they reported, not one assigned to someone else', async () => {
    const filed = await api('/api/cases', {
      session: sessions.hunter,
      body: {
        title: `Hunter's own report ${Date.now()}`,
        sound: 'hiss',
        soundNote: '',
        description: 'Reported by a hunter about their own street.',
        frequencies: [{ value: 7.05, unit: 'MHz' }],
        schedule: { days: [], pattern: 'intermittent', note: '' },
        position: { lat: -31.51, lon: 129.41 + (Date.now() % 1000) / 1e5, source: 'map' },
        consentShareName: false,
      },
    });
    expect(filed.status, filed.text).toBe(201);
    const id = filed.json.case.id;
    expect((await api(`/api/cases/${id}`, { session: sessions.hunter })).status).toBe(200);
    const listed = await api(`/api/cases?q=${encodeURIComponent(filed.json.case.reference)}`, { session: sessions.hunter });
    expect(listed.json.items.map((c: { id: string }) => c.id)).toEqual([id]);
    // The matrix's neighbour case is unassigned and reported by the coordinator: neither list nor page.
    const other = await api(`/api/cases?q=${encodeURIComponent('Matrix neighbour case')}`, { session: sessions.hunter });
    expect(other.json.items.map((c: { id: string }) => c.id)).not.toContain(ids.otherLocatedCase);
    expect((await api(`/api/cases/${ids.otherLocatedCase}`, { session: sessions.hunter })).status).toBe(404);
  });
});
