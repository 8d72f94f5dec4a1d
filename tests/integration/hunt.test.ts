/**
 * The hunt through the real API and PostgreSQL: reports, access, assignment, bearings, sweeps,
 * fixes, transitions, merge. Geometry built with GeographicLib (Karney 2013) as the truth;
 * coordinates are open land (invented, demo only).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { calculateMagVarForDecimalYear } from 'magvar';
import { api, signIn, uniqueEmail, mailTo, waitFor, type Session } from '../support/http';
import { distanceM, sceneLines } from '../unit/df/support/scene';

let chair: Session, coordinator: Session, hunter: Session, member: Session, otherMember: Session;
let hunterId: string;

const SOURCE = { lat: -31.2, lon: 129.55 };
// Each report lands ~1 km from the previous one, so only the duplicate test makes duplicates.
let filed = 0;
const report = (over: Record<string, unknown> = {}) => ({
  title: 'Hash on 40 m at night',
  sound: 'hash',
  soundNote: '',
  description: 'Covers the whole band after dark.',
  frequencies: [{ value: 7.1, unit: 'MHz' }],
  level: { unit: 'S', sUnits: 7, overDb: 0 },
  schedule: { days: ['mon', 'tue'], fromHour: 19, toHour: 23, pattern: 'continuous', note: '' },
  position: { lat: SOURCE.lat + 0.003, lon: SOURCE.lon - 0.01 * ++filed, source: 'map' },
  consentShareName: false,
  ...over,
});

async function newMember(name: string): Promise<Session> {
  const email = uniqueEmail(name.toLowerCase());
  await api('/api/invitations', { session: chair, body: { email, name, role: 'member' } });
  const mail = await waitFor(async () => (await mailTo(email))[0]);
  const token = new URL(mail.text.match(/https?:\/\/\S+/)[0]).searchParams.get('token');
  await api('/api/password', { body: { token, password: 'member password 1', confirm: 'member password 1' } });
  return signIn(email, 'member password 1');
}

async function fileCase(session: Session, over: Record<string, unknown> = {}) {
  const r = await api('/api/cases', { session, body: report(over) });
  expect(r.status, r.text).toBe(201);
  return r.json;
}

const getCase = async (id: string, s: Session = coordinator) => (await api(`/api/cases/${id}`, { session: s })).json;

async function assign(id: string, to = hunterId) {
  const c = await getCase(id);
  const r = await api(`/api/cases/${id}`, { method: 'PATCH', session: coordinator, body: { version: c.version, assigneeId: to } });
  expect(r.status, r.text).toBe(200);
  return r.json;
}

beforeAll(async () => {
  [chair, coordinator, hunter, member] = await Promise.all(
    ['chair', 'coordinator', 'hunter', 'member'].map((w) => signIn(`${w}@example.test`)),
  );
  otherMember = await newMember('Other');
  hunterId = (await api('/api/auth/session', { session: hunter })).json.user.id;
});

describe('noise reports', () => {
  it('stores bands from typed frequencies and the level in dBm (IARU Region 1: S9 = −73 dBm below 30 MHz, 6 dB per S-unit)', async () => {
    const { case: c } = await fileCase(member, { frequencies: [{ value: 7100, unit: 'kHz' }, { value: 3.65, unit: 'MHz' }, { value: 9.4, unit: 'MHz' }] });
    expect(c.bands).toEqual(['40m', '80m', '9 MHz']);
    expect(c.report.frequenciesKhz).toEqual([7100, 3650, 9400]);
    expect(c.report.levelDbm).toBe(-85); // S7 = −73 − 2·6
    expect(c.status).toBe('open');
    expect(c.reference).toMatch(/^QF-\d{4}-\d{4}$/);
  });

  it('rejects bad input with field issues and writes nothing', async () => {
    const before = (await api('/api/cases?pageSize=1', { session: chair })).json.total;
    const r = await api('/api/cases', { session: member, body: report({ frequencies: [], sound: 'other', soundNote: '', position: { lat: 95, lon: 0, source: 'map' } }) });
    expect(r.status).toBe(400);
    const paths = r.json.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['frequencies', 'position.lat']));
    expect((await api('/api/cases?pageSize=1', { session: chair })).json.total).toBe(before);
  });

  it('flags a report within 500 m of an open case sharing a band, to coordinators only', async () => {
    const here = { lat: -31.3, lon: 129.4 };
    const first = (await fileCase(member, { position: { ...here, source: 'map' } })).case;
    // ~300 m north (1° of latitude ≈ 110.9 km at 31° S; common practice, no source)
    const second = await fileCase(otherMember, { position: { lat: here.lat + 0.0027, lon: here.lon, source: 'device', accuracyM: 8 } });
    expect(second.possibleDuplicate).toBeNull(); // members are not told
    const asCoordinator = await getCase(second.case.id);
    expect(asCoordinator.possibleDuplicate).toMatchObject({ id: first.id, reference: first.reference });
    expect(asCoordinator.can.merge).toBe(true);
    // Different band, same place: not a duplicate.
    const third = await fileCase(otherMember, { position: { ...here, source: 'map' }, frequencies: [{ value: 14.2, unit: 'MHz' }] });
    expect((await getCase(third.case.id)).possibleDuplicate).toBeNull();
    // Far away, same band: not a duplicate.
    const far = await fileCase(otherMember, { position: { lat: here.lat + 0.01, lon: here.lon, source: 'map' } });
    expect((await getCase(far.case.id)).possibleDuplicate).toBeNull();
  });
});

describe('privacy of the reporter', () => {
  it("a member never receives another reporter's case, position or identity", async () => {
    const { case: mine } = await fileCase(member);
    for (const path of [`/api/cases/${mine.id}`, `/api/cases/${mine.id}/events`, `/api/cases/${mine.id}/fix`, `/api/cases/${mine.id}/bearings`]) {
      const r = await api(path, { session: otherMember });
      expect([403, 404]).toContain(r.status);
      expect(r.text).not.toContain('member@example.test');
      expect(r.text).not.toContain(String(mine.reportedPosition?.lat ?? 'none'));
    }
    const list = await api('/api/cases?pageSize=100', { session: otherMember });
    expect(list.json.items.map((c: { id: string }) => c.id)).not.toContain(mine.id);
    expect(JSON.stringify(list.json)).not.toMatch(/reported_?lat|reportedPosition|Dov Pellinger/);
    // The reporter sees their own position; an unassigned hunter does not see the case at all.
    expect((await getCase(mine.id, member)).reportedPosition).toBeTruthy();
    expect((await api(`/api/cases/${mine.id}`, { session: hunter })).status).toBe(404);
    await assign(mine.id);
    const asHunter = await getCase(mine.id, hunter);
    expect(asHunter.reporter.email).toBe('member@example.test');
    expect(asHunter.reportedPosition).toBeTruthy();
  });
});

describe('assignment and optimistic locking', () => {
  it('a stale version gets 409 naming who changed what; nothing is written', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const r = await api(`/api/cases/${c.id}`, { method: 'PATCH', session: chair, body: { version: c.version, title: 'Renamed by a stale page' } });
    expect(r.status).toBe(409);
    expect(r.json.error).toMatch(/Bram Ostrander changed this case \(assigned/);
    expect((await getCase(c.id)).title).toBe(c.title);
  });
});

describe('bearings, fixes and locating', () => {
  it('three lines from GeographicLib geometry give a fix at the source; the case moves to located', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const lines = sceneLines(SOURCE, [
      { fromSourceAzDeg: 10, rangeM: 400, sigmaDeg: 2 },
      { fromSourceAzDeg: 130, rangeM: 350, sigmaDeg: 2 },
      { fromSourceAzDeg: 250, rangeM: 450, sigmaDeg: 2 },
    ]);
    // Two lines are not enough to call it located at 2° (ellipse too long): 422 with the reason.
    for (const l of lines.slice(0, 1)) {
      const r = await api(`/api/cases/${c.id}/bearings`, {
        session: hunter,
        body: { lat: l.lat, lon: l.lon, positionSource: 'device', positionAccuracyM: 5, reference: 'true', azimuthDeg: l.azimuthDeg, sigmaDeg: 2, frequencyKhz: 7100 },
      });
      expect(r.status, r.text).toBe(201);
      expect(r.json.fix.current.fix).toMatchObject({ ok: false, reason: 'too-few-lines' });
    }
    const early = await api(`/api/cases/${c.id}/transitions`, { session: hunter, body: { to: 'located', version: (await getCase(c.id)).version, evidence: 'fix' } });
    expect(early.status).toBe(422);
    expect(early.json.error).toMatch(/no fix yet/);

    let last: any;
    for (const l of lines.slice(1)) {
      last = await api(`/api/cases/${c.id}/bearings`, {
        session: hunter,
        body: { lat: l.lat, lon: l.lon, positionSource: 'map', reference: 'true', azimuthDeg: l.azimuthDeg + 180, quality: 'sharp', frequencyKhz: 7100 },
      });
      expect(last.status, last.text).toBe(201);
    }
    const fix = last.json.fix.current.fix;
    expect(fix.ok).toBe(true);
    expect(distanceM(fix, SOURCE)).toBeLessThan(1); // noise-free lines: within 1 m (GeographicLib truth)
    expect(fix.ellipse.semiMajorM).toBeLessThan(75);
    expect(last.json.fix.locatable).toBe(true);
    expect(last.json.fix.trail.map((t: { lineCount: number }) => t.lineCount)).toEqual([1, 2, 3]);
    expect(last.json.fix.nextSpots.length).toBeGreaterThan(0);
    expect(last.json.fix.current.fix.intersections.length).toBe(3);

    const member403 = await api(`/api/cases/${c.id}/transitions`, { session: member, body: { to: 'located', version: 1, evidence: 'fix' } });
    expect(member403.status).toBe(403);
    const moved = await api(`/api/cases/${c.id}/transitions`, { session: hunter, body: { to: 'located', version: (await getCase(c.id)).version, evidence: 'fix' } });
    expect(moved.status, moved.text).toBe(200);
    expect(moved.json.status).toBe('located');
    const events = (await api(`/api/cases/${c.id}/events`, { session: coordinator })).json.items.map((e: { kind: string }) => e.kind);
    expect(events).toEqual(['reported', 'assigned', 'bearing-added', 'bearing-added', 'bearing-added', 'status-changed']);
    // The reporter's timeline shows the report and the status change, not the hunt's details.
    const mine = (await api(`/api/cases/${c.id}/events`, { session: member })).json.items.map((e: { kind: string }) => e.kind);
    expect(mine).toEqual(['reported', 'status-changed']);
  });

  it('converts magnetic bearings with the WMM2025 declination for the place and date (magvar, NOAA/BGS coefficients)', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const takenAt = '2026-06-01T10:00:00Z';
    const r = await api(`/api/cases/${c.id}/bearings`, {
      session: hunter,
      body: { lat: SOURCE.lat, lon: SOURCE.lon + 0.01, positionSource: 'map', reference: 'magnetic', azimuthDeg: 200, takenAt },
    });
    expect(r.status, r.text).toBe(201);
    const b = r.json.bearing;
    const yearFraction = 2026 + (Date.parse(takenAt) - Date.UTC(2026, 0, 1)) / (365 * 86400e3);
    const expected = calculateMagVarForDecimalYear(yearFraction, SOURCE.lat, SOURCE.lon + 0.01, 0);
    expect(b.declinationDeg).toBeCloseTo(expected, 2);
    expect(b.azimuthTrueDeg).toBeCloseTo(200 + expected, 2);
    expect(b.sigmaDeg).toBe(4); // "fair" preset when nothing is said (common practice, no source)
  });

  it('refuses a poor device position unless confirmed', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const body = { lat: SOURCE.lat, lon: SOURCE.lon + 0.004, positionSource: 'device', positionAccuracyM: 85, reference: 'true', azimuthDeg: 270 };
    const refused = await api(`/api/cases/${c.id}/bearings`, { session: hunter, body });
    expect(refused.status).toBe(422);
    expect(refused.json.code).toBe('accuracy-unconfirmed');
    expect((await api(`/api/cases/${c.id}/bearings`, { session: hunter })).json.total).toBe(0);
    const ok = await api(`/api/cases/${c.id}/bearings`, { session: hunter, body: { ...body, accuracyConfirmed: true } });
    expect(ok.status).toBe(201);
  });

  it('edits keep history; exclusion recomputes the fix; only the author or a coordinator may edit', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const lines = sceneLines(SOURCE, [
      { fromSourceAzDeg: 0, rangeM: 500 },
      { fromSourceAzDeg: 90, rangeM: 500 },
      { fromSourceAzDeg: 200, rangeM: 500 },
    ]);
    const ids: string[] = [];
    for (const l of lines) {
      const r = await api(`/api/cases/${c.id}/bearings`, { session: hunter, body: { lat: l.lat, lon: l.lon, positionSource: 'map', reference: 'true', azimuthDeg: l.azimuthDeg, sigmaDeg: 3 } });
      ids.push(r.json.bearing.id);
    }
    const b0 = (await api(`/api/cases/${c.id}/bearings`, { session: hunter })).json.items[0];
    const edit = await api(`/api/cases/${c.id}/bearings/${b0.id}`, { method: 'PATCH', session: hunter, body: { version: b0.version, note: 'null was shallow', azimuthDeg: b0.azimuthEnteredDeg + 1 } });
    expect(edit.status, edit.text).toBe(200);
    expect(edit.json.bearing).toMatchObject({ version: 2, revisions: 1, note: 'null was shallow' });
    const stale = await api(`/api/cases/${c.id}/bearings/${b0.id}`, { method: 'PATCH', session: coordinator, body: { version: 1, excluded: true } });
    expect(stale.status).toBe(409);
    const excl = await api(`/api/cases/${c.id}/bearings/${b0.id}`, { method: 'PATCH', session: coordinator, body: { version: 2, excluded: true } });
    expect(excl.status).toBe(200);
    expect(excl.json.fix.current.lineCount).toBe(2);
    expect((await api(`/api/cases/${c.id}/bearings`, { session: hunter })).json.total).toBe(3); // never deleted
    // Another hunter who is not assigned cannot even see the case.
    expect((await api(`/api/cases/${c.id}/bearings/${b0.id}`, { method: 'PATCH', session: member, body: { version: 3, excluded: false } })).status).toBe(403);
  });

  it('a rotation sweep becomes a bearing through the small-loop fit', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    // Small-loop pattern (common practice, no source): power ∝ sin²(θ − null) plus a floor 35 dB down.
    const nullDeg = 63;
    const samples = Array.from({ length: 18 }, (_, i) => {
      const a = i * 10;
      const p = Math.sin(((a - nullDeg) * Math.PI) / 180) ** 2 + 10 ** (-35 / 10);
      return { azimuthDeg: a, level: -60 + 10 * Math.log10(p) };
    });
    const r = await api(`/api/cases/${c.id}/sweeps`, { session: hunter, body: { lat: SOURCE.lat, lon: SOURCE.lon + 0.005, positionSource: 'map', reference: 'true', samples, frequencyKhz: 7100 } });
    expect(r.status, r.text).toBe(201);
    expect(r.json.sweepFit.nullAzimuthDeg).toBeCloseTo(nullDeg, 1);
    expect(r.json.sweepFit.nullDepthDb).toBeGreaterThan(33);
    expect(r.json.bearing.azimuthTrueDeg).toBeCloseTo(nullDeg, 1);
    expect(r.json.bearing.sweep.samples).toHaveLength(18);
    const flat = await api(`/api/cases/${c.id}/sweeps`, {
      session: hunter,
      body: { lat: SOURCE.lat, lon: SOURCE.lon, positionSource: 'map', reference: 'true', samples: samples.map((s) => ({ ...s, level: -80 })) },
    });
    expect(flat.status).toBe(422);
    expect(flat.json.code).toBe('sweep-fit-failed');
  });
});

describe('status rules', () => {
  async function locatedCase() {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    await api(`/api/cases/${c.id}/comments`, { session: hunter, body: { text: 'Heard it loudest at the fence of the field shed.', premisesConfirmed: true } });
    const v = (await getCase(c.id)).version;
    const r = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'located', version: v, evidence: 'premises' } });
    expect(r.status, r.text).toBe(200);
    return r.json;
  }

  it('premises evidence needs a hunter’s confirmation and a coordinator', async () => {
    const { case: c } = await fileCase(member);
    await assign(c.id);
    const v = (await getCase(c.id)).version;
    const none = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'located', version: v, evidence: 'premises' } });
    expect(none.status).toBe(422);
    await api(`/api/cases/${c.id}/comments`, { session: hunter, body: { text: 'Confirmed on foot.', premisesConfirmed: true } });
    const byHunter = await api(`/api/cases/${c.id}/transitions`, { session: hunter, body: { to: 'located', version: v, evidence: 'premises' } });
    expect(byHunter.status).toBe(403);
    const memberConfirm = await api(`/api/cases/${c.id}/comments`, { session: member, body: { text: 'It is them!', premisesConfirmed: true } });
    expect(memberConfirm.status).toBe(403);
    expect((await locatedCase()).status).toBe('located');
  });

  it('notified by hand-delivered letter (coordinator), resolved with an outcome and levels, reopened with a reason', async () => {
    const c = await locatedCase();
    expect((await api(`/api/cases/${c.id}/transitions`, { session: hunter, body: { to: 'notified', version: c.version, method: 'hand-delivered', deliveredOn: '2026-11-30' } })).status).toBe(403);
    const future = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'notified', version: c.version, method: 'hand-delivered', deliveredOn: '2999-01-01' } });
    expect(future.status).toBe(422);
    const n = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'notified', version: c.version, method: 'hand-delivered', deliveredOn: '2026-11-30' } });
    expect(n.status, n.text).toBe(200);
    const noOutcome = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'resolved', version: n.json.version } });
    expect(noOutcome.status).toBe(400);
    const res = await api(`/api/cases/${c.id}/transitions`, {
      session: coordinator,
      body: { to: 'resolved', version: n.json.version, outcome: 'fixed-by-owner', levelBeforeDbm: -85, levelAfterDbm: -104 },
    });
    expect(res.status).toBe(200);
    expect(res.json).toMatchObject({ status: 'resolved', outcome: 'fixed-by-owner', levelBeforeDbm: -85, levelAfterDbm: -104 });
    const noReason = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'open', version: res.json.version, reason: '' } });
    expect(noReason.status).toBe(400);
    const back = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'open', version: res.json.version, reason: 'The noise came back.' } });
    expect(back.status).toBe(200);
    expect(back.json).toMatchObject({ status: 'open', outcome: null });
    const wrongFrom = await api(`/api/cases/${c.id}/transitions`, { session: coordinator, body: { to: 'notified', version: back.json.version, method: 'hand-delivered', deliveredOn: '2026-11-30' } });
    expect(wrongFrom.status).toBe(422);
  });

  it('two coordinators racing on one version: one wins, the other gets 409', async () => {
    const c = await locatedCase();
    const body = { to: 'resolved', version: c.version, outcome: 'not-found' };
    const [a, b] = await Promise.all([
      api(`/api/cases/${c.id}/transitions`, { session: coordinator, body }),
      api(`/api/cases/${c.id}/transitions`, { session: chair, body }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const events = (await api(`/api/cases/${c.id}/events`, { session: coordinator })).json.items.filter((e: { kind: string }) => e.kind === 'status-changed');
    expect(events).toHaveLength(2); // located + one resolved
  });
});

describe('merging a duplicate into the older case', () => {
  it('moves bearings and bands, resolves the newer case as duplicate, and records it on both timelines', async () => {
    const here = { lat: -31.4, lon: 129.3 };
    const older = (await fileCase(member, { position: { ...here, source: 'map' } })).case;
    const newer = (await fileCase(otherMember, { position: { lat: here.lat + 0.001, lon: here.lon, source: 'map' }, frequencies: [{ value: 7.05, unit: 'MHz' }, { value: 10.12, unit: 'MHz' }] })).case;
    await assign(newer.id);
    await api(`/api/cases/${newer.id}/bearings`, { session: hunter, body: { lat: here.lat, lon: here.lon + 0.004, positionSource: 'map', reference: 'true', azimuthDeg: 270 } });
    const v = (await getCase(newer.id)).version;
    expect((await api(`/api/cases/${older.id}/merge`, { session: coordinator, body: { intoCaseId: newer.id, version: (await getCase(older.id)).version } })).status).toBe(422);
    expect((await api(`/api/cases/${newer.id}/merge`, { session: hunter, body: { intoCaseId: older.id, version: v } })).status).toBe(403);
    const r = await api(`/api/cases/${newer.id}/merge`, { session: coordinator, body: { intoCaseId: older.id, version: v } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.bands).toEqual(['40m', '30m']);
    expect((await api(`/api/cases/${older.id}/bearings`, { session: coordinator })).json.total).toBe(1);
    const dup = await getCase(newer.id);
    expect(dup).toMatchObject({ status: 'resolved', outcome: 'duplicate', mergedInto: { id: older.id, reference: older.reference } });
    const olderEvents = (await api(`/api/cases/${older.id}/events`, { session: coordinator })).json.items.map((e: { kind: string }) => e.kind);
    expect(olderEvents).toContain('merged-in');
    const newerEvents = (await api(`/api/cases/${newer.id}/events`, { session: otherMember })).json.items.map((e: { kind: string }) => e.kind);
    expect(newerEvents).toContain('merged-into');
    // The newer case's reporter still cannot open the older case (another reporter's).
    expect((await api(`/api/cases/${older.id}`, { session: otherMember })).status).toBe(404);
  });
});
