/**
 * Hostile input on every JSON route: NUL and other C0 control characters, lone UTF-16 surrogates,
 * 1 MB strings, deep nesting and wrong types. Every answer is a 4xx with a plain message and
 * nothing is written (row counts and the digests of the rows the requests aim at stay the same).
 * A fixed table gives every field every kind once; fast-check (bounded runs) then picks routes,
 * fields, characters and positions at random. Also: broken percent-encoding in paths, and bad
 * callback URLs on next-auth's endpoints.
 */
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { deriveToken } from '@/lib/notices/token';
import { api, APP_ORIGIN, BASE_URL, signIn, type Session } from '../support/http';
import { dbState } from '../support/db-state';
import { noiseReport } from '../support/fixtures';
import { gpxOf, iso, walk } from '../support/survey';

let chair: Session, coordinator: Session, member: Session;
const ids: Record<string, string> = {};
const versions: Record<string, number> = {};

/** A JSON route, a valid body for it, and which of its fields are strings (the rest get wrong types too). */
type Target = {
  name: string;
  method: 'POST' | 'PATCH' | 'PUT';
  path: () => string;
  who: () => Session | undefined;
  body: () => Record<string, unknown>;
  /** dotted paths of string fields */
  text: string[];
  /** dotted paths of fields that are not strings */
  other?: string[];
};

const TARGETS: Target[] = [
  { name: 'file a report', method: 'POST', path: () => '/api/cases', who: () => member, body: () => noiseReport({ soundNote: 'rough', schedule: { days: ['mon'], pattern: 'continuous', note: 'after dark' } }), text: ['title', 'soundNote', 'description', 'schedule.note', 'sound'], other: ['frequencies', 'position.lat', 'consentShareName'] },
  { name: 'edit a case', method: 'PATCH', path: () => `/api/cases/${ids.case}`, who: () => coordinator, body: () => ({ version: versions.case, title: 'A better title', description: 'More words.' }), text: ['title', 'description', 'assigneeId'], other: ['version'] },
  { name: 'change status', method: 'POST', path: () => `/api/cases/${ids.case}/transitions`, who: () => coordinator, body: () => ({ to: 'located', version: versions.case, evidence: 'premises', note: 'Peaks at the gate.' }), text: ['note', 'evidence', 'to'], other: ['version'] },
  { name: 'add a bearing', method: 'POST', path: () => `/api/cases/${ids.case}/bearings`, who: () => coordinator, body: () => ({ lat: -31.4, lon: 129.3, positionSource: 'map', reference: 'true', azimuthDeg: 40, quality: 'sharp', note: 'From the lane.' }), text: ['note', 'reference', 'takenAt'], other: ['azimuthDeg', 'lat', 'oneWay'] },
  { name: 'edit a bearing', method: 'PATCH', path: () => `/api/cases/${ids.case}/bearings/${ids.bearing}`, who: () => coordinator, body: () => ({ version: versions.bearing, note: 'Checked again.' }), text: ['note'], other: ['version', 'excluded'] },
  { name: 'add a sweep', method: 'POST', path: () => `/api/cases/${ids.case}/sweeps`, who: () => coordinator, body: () => ({ lat: -31.4, lon: 129.31, positionSource: 'map', reference: 'true', note: 'Sweep at the corner.', samples: [0, 30, 60, 90, 120].map((a) => ({ azimuthDeg: a, level: -90 + Math.abs(a - 60) / 3 })), }), text: ['note', 'levelUnit'], other: ['samples', 'samples.0.level'] },
  { name: 'comment', method: 'POST', path: () => `/api/cases/${ids.case}/comments`, who: () => member, body: () => ({ text: 'Still there tonight.' }), text: ['text'], other: ['premisesConfirmed'] },
  { name: 'merge', method: 'POST', path: () => `/api/cases/${ids.case}/merge`, who: () => coordinator, body: () => ({ intoCaseId: ids.located, version: versions.case }), text: ['intoCaseId'], other: ['version'] },
  { name: 'compute a fix', method: 'POST', path: () => '/api/df/fix', who: () => member, body: () => ({ lines: [{ id: 'a', lat: -31.06, lon: 129.74, azimuthDeg: 30 }, { id: 'b', lat: -31.06, lon: 129.76, azimuthDeg: 330 }] }), text: ['lines.0.id'], other: ['lines.1.azimuthDeg', 'confidence'] },
  { name: 'change own profile', method: 'PATCH', path: () => '/api/profile', who: () => member, body: () => ({ name: 'Quinn Member', callSign: 'Q1MEM' }), text: ['name', 'callSign', 'bearingReference'], other: ['sMeterOffsetDb', 'loopSizeM'] },
  { name: 'invite', method: 'POST', path: () => '/api/invitations', who: () => coordinator, body: () => ({ email: 'fuzz-invite@example.test', name: 'Fuzz Person', role: 'member' }), text: ['email', 'name', 'role'] },
  { name: 'change a user', method: 'PATCH', path: () => `/api/users/${ids.member}`, who: () => chair, body: () => ({ role: 'member' }), text: ['role'], other: ['active'] },
  { name: 'draft a notice', method: 'POST', path: () => `/api/cases/${ids.located}/notices`, who: () => coordinator, body: () => ({ templateKey: 'first-notice', recipientName: 'The householder', postalAddress: '12 Fuzz Lane, Quillon', email: 'house@example.test', personalNote: 'Thank you.' }), text: ['templateKey', 'recipientName', 'postalAddress', 'email', 'personalNote'] },
  { name: 'edit a draft notice', method: 'PATCH', path: () => `/api/cases/${ids.located}/notices/${ids.notice}`, who: () => coordinator, body: () => ({ version: versions.notice, recipientName: 'The occupant', postalAddress: '13 Fuzz Lane, Quillon', personalNote: 'Thanks.' }), text: ['recipientName', 'postalAddress', 'personalNote', 'email'], other: ['version'] },
  { name: 'approve a notice', method: 'POST', path: () => `/api/cases/${ids.located}/notices/${ids.notice}/approve`, who: () => coordinator, body: () => ({ version: versions.notice }), text: [], other: ['version'] },
  { name: 'send a notice', method: 'POST', path: () => `/api/cases/${ids.located}/notices/${ids.notice}/send`, who: () => coordinator, body: () => ({ idempotencyKey: 'fuzz-key-0001' }), text: ['idempotencyKey'] },
  { name: 'record a letter delivered', method: 'POST', path: () => `/api/cases/${ids.located}/notices/${ids.notice}/delivered`, who: () => coordinator, body: () => ({ deliveredOn: '2026-11-30' }), text: ['deliveredOn'] },
  { name: 'save a template', method: 'PUT', path: () => '/api/templates/first-notice', who: () => chair, body: () => ({ version: versions.template, subject: 'About radio noise', body: 'Dear neighbour, a device near you may be causing radio noise.' }), text: ['subject', 'body'], other: ['version'] },
  { name: 'forgot password', method: 'POST', path: () => '/api/password/forgot', who: () => undefined, body: () => ({ email: 'member@example.test' }), text: ['email'] },
  { name: 'change own password', method: 'POST', path: () => '/api/password/change', who: () => member, body: () => ({ current: 'quietfix-demo', password: 'a new long password', confirm: 'a new long password' }), text: ['current', 'password', 'confirm'] },
  { name: 'set a password', method: 'POST', path: () => '/api/password', who: () => undefined, body: () => ({ token: 'T'.repeat(43), password: 'a long password', confirm: 'a long password' }), text: ['token', 'password', 'confirm'] },
  { name: 'answer a notice', method: 'POST', path: () => `/api/r/${ids.token}/answers`, who: () => undefined, body: () => ({ kind: 'contact-me', message: 'Happy to help.', contact: 'house@example.test' }), text: ['kind', 'message', 'contact'] },
  { name: 'add a level reading', method: 'POST', path: () => `/api/cases/${ids.case}/readings`, who: () => coordinator, body: () => ({ clientId: randomUUID(), lat: -31.4, lon: 129.31, accuracyM: 6, level: { unit: 'S', value: 7 }, frequencyKhz: 7100, takenAt: '2026-12-02T05:00:00Z', note: 'By the gate.' }), text: ['note', 'takenAt', 'clientId', 'level.unit'], other: ['lat', 'level.value', 'accuracyM'] },
  // The routes later issues added (evidence, the committee's week): the same boundary holds for them.
  { name: 'import a walked survey', method: 'POST', path: () => `/api/cases/${ids.case}/readings/import`, who: () => coordinator, body: () => ({ gpx: gpxOf(walk), csv: `time,level\n${iso(10)},5\n`, toleranceS: 5, frequencyKhz: 7100 }), text: ['gpx', 'csv'], other: ['toleranceS', 'frequencyKhz'] },
  { name: 'log a level', method: 'POST', path: () => `/api/cases/${ids.case}/levels`, who: () => coordinator, body: () => ({ clientId: randomUUID(), frequencyKhz: 7100, level: { unit: 'S', value: 6 }, bandwidthHz: 2400, takenAt: '2026-12-02T05:00:00Z', phase: 'before' }), text: ['clientId', 'takenAt', 'phase', 'level.unit'], other: ['frequencyKhz', 'bandwidthHz', 'level.value'] },
  { name: 'confirm the premises', method: 'PUT', path: () => `/api/cases/${ids.case}/premises`, who: () => coordinator, body: () => ({ address: '5 Fuzz Lane, Quillon', lat: -31.45, lon: 129.36, how: 'level-peak', note: 'Peak at the gate.' }), text: ['address', 'note', 'how'], other: ['lat'] },
  { name: 'ask to upload a file', method: 'POST', path: () => `/api/cases/${ids.case}/files`, who: () => member, body: () => ({ name: 'hum at the gate.wav', size: 48_000, contentType: 'audio/wav' }), text: ['name', 'contentType'], other: ['size'] },
  { name: 'save a queue view', method: 'POST', path: () => '/api/saved-filters', who: () => coordinator, body: () => ({ name: 'Open on 40 m', query: 'status=open&band=40m' }), text: ['name', 'query'] },
  { name: 'bulk assign', method: 'POST', path: () => '/api/cases/bulk-assign', who: () => coordinator, body: () => ({ caseIds: [ids.case], assigneeId: ids.hunter }), text: ['caseIds.0', 'assigneeId'], other: ['caseIds'] },
  { name: 'change club settings', method: 'PATCH', path: () => '/api/settings', who: () => chair, body: () => ({ clubName: 'Quillon Radio Circle', contactEmail: 'committee@example.test', noiseEnvironment: 'rural', reminderDays: 10 }), text: ['clubName', 'contactEmail', 'noiseEnvironment'], other: ['reminderDays', 'locateThresholdM'] },
];

/** Characters no free-text field may hold: NUL, the other C0 controls but tab and newlines, DEL, and lone surrogate halves. */
const CONTROLS = [...Array(32).keys()].filter((c) => ![9, 10, 13].includes(c)).concat(0x7f);
const badChar = fc.oneof(
  fc.constantFrom(...CONTROLS).map((c) => String.fromCharCode(c)),
  fc.integer({ min: 0xd800, max: 0xdbff }).map((c) => String.fromCharCode(c)),
  fc.integer({ min: 0xdc00, max: 0xdfff }).map((c) => String.fromCharCode(c)),
);

const ONE_MB = 'q'.repeat(1_000_001);
const nested = (depth: number): unknown => {
  let v: unknown = 'deep';
  for (let i = 0; i < depth; i++) v = i % 2 ? { v } : [v];
  return v;
};
const WRONG_FOR_TEXT = [0, 12.5, true, [], {}, ['text']];
const WRONG_FOR_OTHER = ['a string', { n: 1 }, [[]]];

function setPath(obj: Record<string, unknown>, path: string, value: unknown): Record<string, unknown> {
  const keys = path.split('.');
  let at: any = obj;
  for (const k of keys.slice(0, -1)) at = at[k] ?? (at[k] = {});
  at[keys.at(-1)!] = value;
  return obj;
}
const getPath = (obj: Record<string, unknown>, path: string): unknown => path.split('.').reduce<any>((o, k) => o?.[k], obj);

/** `value` with `bad` inserted at position `pos` (modulo its length + 1). */
function insertAt(value: unknown, bad: string, pos: number): string {
  const s = typeof value === 'string' ? value : 'plain words';
  const i = pos % (s.length + 1);
  return s.slice(0, i) + bad + s.slice(i);
}

const seen = new Map<string, number>();
async function send(t: Target, body: Record<string, unknown> | string) {
  const r = await api(t.path(), { method: t.method, session: t.who(), body: typeof body === 'string' ? body : JSON.stringify(body) });
  seen.set(String(r.status), (seen.get(String(r.status)) ?? 0) + 1);
  return r;
}

/** The answer every hostile request must get: a 4xx (400 when `field` names the bad field) with a readable message. */
function expectRefused(r: Awaited<ReturnType<typeof api>>, label: string, field?: string) {
  expect(r.status, `${label}: ${r.text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(r.status, `${label}: ${r.text.slice(0, 300)}`).toBeLessThan(500);
  expect(typeof r.json?.error, label).toBe('string');
  if (field) {
    expect(r.status, label).toBe(400);
    const paths: string[] = r.json.issues?.map((i: { path: string }) => i.path) ?? [];
    expect(paths.some((p) => p === field || p.startsWith(`${field}.`)), `${label}: issues at ${paths.join(', ')}`).toBe(true);
  }
}

let before: Awaited<ReturnType<typeof dbState>>;
const watched = () => ({
  cases: [ids.case, ids.located],
  bearings: [ids.bearing],
  notices: [ids.notice, ids.approved],
  users: [ids.member],
  'notice_templates.key': ['first-notice'],
  club_settings: ['1'],
});

beforeAll(async () => {
  [chair, coordinator, member] = await Promise.all(['chair', 'coordinator', 'member'].map((w) => signIn(`${w}@example.test`)));
  ids.member = (await api('/api/auth/session', { session: member })).json.user.id;
  ids.hunter = (await db('users').where({ email: 'hunter@example.test' }).first('id')).id;
  const filed = await api('/api/cases', { session: member, body: { ...TARGETS[0].body(), title: 'Fuzz target case', position: { lat: -31.45, lon: 129.36, source: 'map' } } });
  expect(filed.status, filed.text).toBe(201);
  ids.case = filed.json.case.id;
  const bearing = await api(`/api/cases/${ids.case}/bearings`, { session: coordinator, body: TARGETS[3].body() });
  expect(bearing.status, bearing.text).toBe(201);
  [ids.bearing, versions.bearing] = [bearing.json.bearing.id, bearing.json.bearing.version];
  versions.case = (await api(`/api/cases/${ids.case}`, { session: coordinator })).json.version;
  ids.located = (await api('/api/cases?q=Warbling', { session: coordinator })).json.items[0].id;
  const stamp = Date.now();
  const draftIn = (n: number) => ({ ...TARGETS[12].body(), postalAddress: `${n} Fuzz Row, Quillon ${stamp}` });
  const d = await api(`/api/cases/${ids.located}/notices`, { session: coordinator, body: draftIn(1) });
  expect(d.status, d.text).toBe(201);
  [ids.notice, versions.notice] = [d.json.notice.id, d.json.notice.version];
  const a = await api(`/api/cases/${ids.located}/notices`, { session: coordinator, body: draftIn(2) });
  ids.approved = a.json.notice.id;
  expect((await api(`/api/cases/${ids.located}/notices/${ids.approved}/approve`, { session: coordinator, body: { version: a.json.notice.version } })).status).toBe(200);
  const { token_nonce } = await db('notices').where({ id: ids.approved }).first('token_nonce');
  ids.token = deriveToken(ids.approved, token_nonce);
  versions.template = (await api('/api/templates/first-notice', { session: chair })).json.version;
  before = await dbState(watched());
});

afterAll(() => {
  const summary = [...seen].sort().map(([s, n]) => `${s}×${n}`).join(' ');
  console.log(`[hostile input] statuses seen: ${summary}`);
});

describe('every JSON route, every field, every kind of hostile input (table)', () => {
  const cells = TARGETS.flatMap((t) => [
    ...t.text.flatMap((field) => [
      { t, field, kind: 'NUL', value: (v: unknown) => insertAt(v, '\u0000', 3), expectField: true },
      { t, field, kind: 'control U+001B', value: (v: unknown) => insertAt(v, '\u001b', 1), expectField: true },
      { t, field, kind: 'lone high surrogate', value: (v: unknown) => insertAt(v, '\ud83d', 2), expectField: true },
      { t, field, kind: 'lone low surrogate', value: (v: unknown) => insertAt(v, '\ude00', 0), expectField: true },
      { t, field, kind: '1 MB string', value: () => ONE_MB, expectField: false },
      { t, field, kind: 'nested 40 deep', value: () => nested(40), expectField: false },
      ...WRONG_FOR_TEXT.map((w) => ({ t, field, kind: `wrong type ${JSON.stringify(w)}`, value: () => w, expectField: true })),
    ]),
    ...(t.other ?? []).flatMap((field) => WRONG_FOR_OTHER.map((w) => ({ t, field, kind: `wrong type ${JSON.stringify(w)}`, value: () => w, expectField: true }))),
  ]);
  it(`answers ${cells.length} hostile bodies with a 4xx and a message`, async () => {
    for (const c of cells) {
      const body = c.t.body();
      setPath(body, c.field, c.value(getPath(body, c.field)));
      const r = await send(c.t, body);
      expectRefused(r, `${c.t.name}: ${c.field} ${c.kind}`, c.expectField ? c.field : undefined);
    }
  });

  it('answers bodies that are not JSON, too deep as a whole, or over 1 MB with 400 / 413', async () => {
    for (const t of TARGETS) {
      for (const [kind, body] of [
        ['not JSON', '{"title": '],
        ['100000 levels of nesting', '['.repeat(100_000) + ']'.repeat(100_000)],
        ['1 MB of padding', JSON.stringify({ ...t.body(), padding: ONE_MB })],
      ] as const) {
        expectRefused(await send(t, body), `${t.name}: ${kind}`);
      }
      const bytes = await fetch(`${BASE_URL}${t.path()}`, {
        method: t.method,
        headers: { origin: APP_ORIGIN, 'content-type': 'application/json', ...(t.who() ? { cookie: t.who()!.cookie } : {}) },
        body: new Uint8Array([0x7b, 0x22, 0x61, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0x22, 0x7d]), // {"a":"<not UTF-8>"}
      });
      seen.set(String(bytes.status), (seen.get(String(bytes.status)) ?? 0) + 1);
      expect([400, 404], `${t.name}: invalid UTF-8`).toContain(bytes.status);
    }
  });
});

describe('random hostile input (fast-check, bounded)', () => {
  const fields = TARGETS.flatMap((t) => t.text.map((field) => ({ t, field })));
  it('a bad character anywhere in any text field is a 400 naming that field', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...fields), badChar, fc.nat(), fc.string({ maxLength: 20 }), async ({ t, field }, bad, pos, extra) => {
        const body = t.body();
        const base = getPath(body, field);
        setPath(body, field, insertAt(typeof base === 'string' ? base + extra.replace(/[\u0000-\u001f\u007f\ud800-\udfff]/g, '') : base, bad, pos));
        expectRefused(await send(t, body), `${t.name}: ${field} with U+${bad.charCodeAt(0).toString(16)}`, field);
      }),
      { numRuns: 120 },
    );
  });

  it('any nesting deeper than 32 levels or any non-string value in a text field is a 4xx', async () => {
    const value = fc.oneof(
      fc.integer({ min: 33, max: 3000 }).map(nested),
      fc.oneof(fc.double(), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }), fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 })),
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...fields), value, async ({ t, field }, v) => {
        // null is a legal value for the nullable call sign and assignee (a bulk unassignment, too)
        fc.pre(!(v === null && ['callSign', 'assigneeId'].includes(field)));
        expectRefused(await send(t, setPath(t.body(), field, v)), `${t.name}: ${field} = ${JSON.stringify(v).slice(0, 60)}`);
      }),
      { numRuns: 60 },
    );
  });

  it('search and address parameters with control characters are a 400 (a query string cannot carry a lone surrogate)', async () => {
    const params = [
      ['/api/cases', 'q'],
      ['/api/cases', 'band'],
      ['notices', 'address'],
    ];
    const control = fc.constantFrom(...CONTROLS).map((c) => String.fromCharCode(c));
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...params), control, fc.nat(), async ([path, key], bad, pos) => {
        const p = path === 'notices' ? `/api/cases/${ids.located}/notices` : path;
        const r = await api(`${p}?${key}=${encodeURIComponent(insertAt('Warbling', bad, pos))}`, { session: coordinator });
        seen.set(String(r.status), (seen.get(String(r.status)) ?? 0) + 1);
        expectRefused(r, `${key} with U+${bad.charCodeAt(0).toString(16)}`, key);
      }),
      { numRuns: 40 },
    );
    // Percent-encoded surrogate bytes decode to U+FFFD: an ordinary (empty) search.
    expect((await api('/api/cases?q=%ED%A0%BD', { session: coordinator })).status).toBe(200);
  });

  it('wrote nothing', async () => {
    expect(await dbState(watched())).toEqual(before);
  });
});

describe('broken addresses', () => {
  it('answers malformed percent-encoding in an API path with a 400 JSON message', async () => {
    for (const path of ['/api/cases/%FF', '/api/cases/%ED%A0%BD', '/api/cases/%E0%A4%A/events', `/api/r/%ED%A0%BD`, '/api/templates/%C0%AF']) {
      const r = await api(path, { session: coordinator });
      expect(r.status, path).toBe(400);
      expect(r.json.error, path).toMatch(/percent-encoding/);
    }
    const post = await api('/api/r/%ED%A0%BD/answers', { body: { kind: 'fixed-it' } });
    expect(post.status).toBe(400);
  });

  it('answers random percent-encoded bytes in a path segment with 400 or 404 JSON, never 500', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom('/api/cases/', '/api/r/', '/api/templates/', 'notices'),
        fc.uint8Array({ minLength: 1, maxLength: 6 }),
        async (where, bytes) => {
          // "%2E" and "%2E%2E" are dot segments: URL rules resolve them (a 308 to the parent), not an error.
          fc.pre(!/^\.{1,2}$/.test(String.fromCharCode(...bytes)));
          const prefix = where === 'notices' ? `/api/cases/${ids.located}/notices/` : where;
          const segment = [...bytes].map((b) => `%${b.toString(16).padStart(2, '0').toUpperCase()}`).join('');
          const r = await api(prefix + segment, { session: chair });
          seen.set(String(r.status), (seen.get(String(r.status)) ?? 0) + 1);
          expect([400, 404], `${prefix}${segment}: ${r.text.slice(0, 200)}`).toContain(r.status);
          expect(r.headers.get('content-type')).toMatch(/application\/json/);
        },
      ),
      { numRuns: 40 },
    );
  });

  it('shows the not-found page for malformed percent-encoding in a page path', async () => {
    for (const path of ['/r/%ED%A0%BD', '/r/%FF', `/cases/%FF`]) {
      const res = await fetch(`${BASE_URL}${path}`, { headers: { cookie: coordinator.cookie }, redirect: 'manual' });
      expect(res.status, path).toBe(404);
      expect(res.headers.get('content-type')).toMatch(/text\/html/);
      expect(await res.text()).toContain('Nothing here');
    }
  });
});

describe("next-auth's endpoints with a bad callback URL", () => {
  const BAD = ['http://[', '%E0%A4%A', 'javascript:alert(1)', 'https://elsewhere.example.test/x', '/\\elsewhere.example.test/'];
  it('a bad callbackUrl parameter or cookie never makes a 500, and never leaves the site', async () => {
    for (const bad of BAD) {
      const page = await fetch(`${BASE_URL}/api/auth/signin?callbackUrl=${encodeURIComponent(bad)}`, { redirect: 'manual' });
      expect(page.status, bad).toBeLessThan(500);
      const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
      const { csrfToken } = await csrf.json();
      const jar = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
      const out = await fetch(`${BASE_URL}/api/auth/signout?callbackUrl=${encodeURIComponent(bad)}`, {
        method: 'POST',
        headers: {
          origin: APP_ORIGIN,
          'content-type': 'application/x-www-form-urlencoded',
          cookie: [...jar, `next-auth.callback-url=${encodeURIComponent(bad)}`].join('; '),
        },
        body: new URLSearchParams({ csrfToken, json: 'true', callbackUrl: bad }),
      });
      expect(out.status, `${bad}: ${await out.clone().text()}`).toBe(200);
      expect(new URL((await out.json()).url).origin).toBe(APP_ORIGIN);
    }
  });
});
