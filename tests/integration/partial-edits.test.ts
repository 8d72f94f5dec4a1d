/**
 * Every PATCH route changes only the fields the request names: untouched fields keep their
 * stored values (read back from PostgreSQL, not only from the answer).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { api, signIn, type Session } from '../support/http';
import { noiseReport } from '../support/fixtures';

let chair: Session, coordinator: Session, member: Session;
let memberId: string, hunterId: string;

/** A row without the columns every write bumps. */
async function stored(table: string, id: string | number, drop: string[] = []) {
  const row = await db(table).where({ id }).first();
  // bookkeeping every write moves (last_activity_at: the queue's sort key, kept by a trigger)
  for (const k of ['version', 'updated_at', 'last_activity_at', ...drop]) delete row[k];
  return row;
}

beforeAll(async () => {
  [chair, coordinator, member] = await Promise.all(['chair', 'coordinator', 'member'].map((w) => signIn(`${w}@example.test`)));
  memberId = (await api('/api/auth/session', { session: member })).json.user.id;
  hunterId = (await db('users').where({ email: 'hunter@example.test' }).first('id')).id;
});

describe('PATCH changes only what it names', () => {
  let caseId: string;

  beforeAll(async () => {
    const r = await api('/api/cases', {
      session: member,
      body: noiseReport({ title: 'Whine on 20 m', sound: 'whine', description: 'Rises and falls every few seconds.', position: { lat: -31.52, lon: 129.41, source: 'map' } }),
    });
    expect(r.status, r.text).toBe(201);
    caseId = r.json.case.id;
    const a = await api(`/api/cases/${caseId}`, { method: 'PATCH', session: coordinator, body: { version: r.json.case.version, assigneeId: hunterId } });
    expect(a.status, a.text).toBe(200);
  });

  it('a case: the title alone keeps the description and the assignee', async () => {
    const c = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
    const before = await stored('cases', caseId, ['title']);
    const r = await api(`/api/cases/${caseId}`, { method: 'PATCH', session: coordinator, body: { version: c.version, title: 'Whine on 20 m, evenings' } });
    expect(r.status, r.text).toBe(200);
    expect(await stored('cases', caseId, ['title'])).toEqual(before);
    expect(before.description).toBe('Rises and falls every few seconds.');
    expect(before.assignee_id).toBe(hunterId);
  });

  it('a bearing: {version, excluded: true} keeps note, one-way flag, azimuth and sigma', async () => {
    const add = await api(`/api/cases/${caseId}/bearings`, {
      session: coordinator,
      body: { lat: -31.5, lon: 129.4, positionSource: 'map', reference: 'true', azimuthDeg: 72, sigmaDeg: 4, oneWay: true, note: 'Sense antenna says east.' },
    });
    expect(add.status, add.text).toBe(201);
    const b = add.json.bearing;
    const before = await stored('bearings', b.id, ['excluded']);
    const r = await api(`/api/cases/${caseId}/bearings/${b.id}`, { method: 'PATCH', session: coordinator, body: { version: b.version, excluded: true } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.bearing.excluded).toBe(true);
    expect(await stored('bearings', b.id, ['excluded'])).toEqual(before);
    expect(before).toMatchObject({ note: 'Sense antenna says east.', one_way: true });
  });

  it('a notice draft: the name alone keeps the e-mail and the personal note', async () => {
    const located = (await api('/api/cases?q=Warbling', { session: coordinator })).json.items[0].id;
    const d = await api(`/api/cases/${located}/notices`, {
      session: coordinator,
      body: { templateKey: 'first-notice', recipientName: 'The householder', postalAddress: `3 Partial Way, Quillon ${Date.now()}`, email: 'partial@example.test', personalNote: 'We met at the gate.' },
    });
    expect(d.status, d.text).toBe(201);
    const n = d.json.notice;
    const before = await stored('notices', n.id, ['recipient_name']);
    const r = await api(`/api/cases/${located}/notices/${n.id}`, { method: 'PATCH', session: coordinator, body: { version: n.version, recipientName: 'The occupant' } });
    expect(r.status, r.text).toBe(200);
    expect(await stored('notices', n.id, ['recipient_name'])).toEqual(before);
    expect(before).toMatchObject({ email: 'partial@example.test', personal_note: 'We met at the gate.' });
  });

  it('a profile: one field keeps the others; a new loop size keeps the shape and recomputes the circumference', async () => {
    const original = (await api('/api/profile', { session: member })).json;
    const full = { name: 'Quinn Member', callSign: 'Q7PAR', loopShape: 'circle', loopSizeM: 1, sMeterOffsetDb: 2, bearingReference: 'magnetic' };
    expect((await api('/api/profile', { method: 'PATCH', session: member, body: full })).status).toBe(200);
    try {
      const before = await stored('users', memberId, ['s_meter_offset_db']);
      const r = await api('/api/profile', { method: 'PATCH', session: member, body: { sMeterOffsetDb: -3 } });
      expect(r.status, r.text).toBe(200);
      expect(r.json.sMeterOffsetDb).toBe(-3);
      expect(await stored('users', memberId, ['s_meter_offset_db'])).toEqual(before);
      const size = await api('/api/profile', { method: 'PATCH', session: member, body: { loopSizeM: 2 } });
      expect(size.status, size.text).toBe(200);
      // circumference of a circle = pi x diameter (geometry)
      expect(size.json).toMatchObject({ loopShape: 'circle', loopSizeM: 2, callSign: 'Q7PAR', bearingReference: 'magnetic' });
      expect(size.json.loopCircumferenceM).toBeCloseTo(Math.PI * 2, 6);
      const empty = await api('/api/profile', { method: 'PATCH', session: member, body: {} });
      expect(empty.status).toBe(400);
    } finally {
      const { email: _e, role: _r, loopCircumferenceM: _c, ...restore } = original;
      await api('/api/profile', { method: 'PATCH', session: member, body: restore });
    }
  });

  it('club settings: one setting alone keeps every other one', async () => {
    const original = (await api('/api/settings', { session: chair })).json.settings;
    // Every setting away from its default first, so a write that fell back to defaults would show.
    const full = { clubName: 'Quillon Partial Circle', contactEmail: 'partial-committee@example.test', locateThresholdM: 60, reminderDays: 9, maxPositionAccuracyM: 25, noiseEnvironment: 'rural', uploadMaxMb: 20 };
    expect((await api('/api/settings', { method: 'PATCH', session: chair, body: full })).status).toBe(200);
    try {
      const before = await stored('club_settings', 1, ['reminder_days']);
      const r = await api('/api/settings', { method: 'PATCH', session: chair, body: { reminderDays: 11 } });
      expect(r.status, r.text).toBe(200);
      expect(r.json.settings).toEqual({ ...full, reminderDays: 11 });
      expect(Object.keys(r.json.changes)).toEqual(['reminderDays']);
      expect(await stored('club_settings', 1, ['reminder_days'])).toEqual(before);
      expect(before).toMatchObject({ club_name: 'Quillon Partial Circle', contact_email: 'partial-committee@example.test', noise_environment: 'rural', upload_max_mb: 20 });
    } finally {
      // (an empty contact address is the unsaved default, which the patch schema does not take back)
      const { contactEmail, ...rest } = original;
      await api('/api/settings', { method: 'PATCH', session: chair, body: contactEmail ? original : rest });
    }
  });

  it('a user: the role alone keeps the active flag, the active flag alone keeps the role', async () => {
    const base = await stored('users', memberId, ['role', 'active']);
    try {
      const role = await api(`/api/users/${memberId}`, { method: 'PATCH', session: chair, body: { role: 'hunter' } });
      expect(role.status, role.text).toBe(200);
      expect(await db('users').where({ id: memberId }).first('role', 'active')).toEqual({ role: 'hunter', active: true });
      const off = await api(`/api/users/${memberId}`, { method: 'PATCH', session: chair, body: { active: false } });
      expect(off.status, off.text).toBe(200);
      expect(await db('users').where({ id: memberId }).first('role', 'active')).toEqual({ role: 'hunter', active: false });
      expect(await stored('users', memberId, ['role', 'active'])).toEqual(base);
    } finally {
      await api(`/api/users/${memberId}`, { method: 'PATCH', session: chair, body: { role: 'member', active: true } });
    }
  });
});
