/**
 * The walked level trail and the offline queue's retries: POST/GET /api/cases/:id/readings
 * (validation, who may, S-units to dBm by IARU Region 1 R.1, the smoothed peak), and clientId
 * idempotency on readings, bearings and sweeps — a repeat answers 200 with the same body and
 * stores nothing new, also when the repeats race each other. Our own fictional cases.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, inTransaction } from '@/db';
import { insertCase } from '@/db/cases';
import { getUserByEmail } from '@/db/users';
import { api, signIn, type Session } from '../support/http';

let hunter: Session;
let coordinator: Session;
let member: Session;
let caseA: string;
let caseB: string;

const reading = (over: Record<string, unknown> = {}) => ({
  clientId: randomUUID(),
  lat: -31.0581,
  lon: 129.7592,
  accuracyM: 5,
  level: { unit: 'S', value: 7 },
  frequencyKhz: 7100,
  takenAt: '2026-12-02T05:10:00Z',
  ...over,
});

beforeAll(async () => {
  [hunter, coordinator, member] = await Promise.all([signIn('hunter@example.test'), signIn('coordinator@example.test'), signIn('member@example.test')]);
  const [m, h] = await Promise.all([getUserByEmail('member@example.test'), getUserByEmail('hunter@example.test')]);
  await inTransaction(async (trx) => {
    const base = { description: '', reporterId: m!.id, reportedLat: -31.058, reportedLon: 129.759, bands: ['40m'], assigneeId: h!.id };
    caseA = (await insertCase(trx, { ...base, title: 'Readings test A' })).id;
    caseB = (await insertCase(trx, { ...base, title: 'Readings test B' })).id;
  });
});

afterAll(async () => {
  await db('cases').whereIn('id', [caseA, caseB]).del();
});

describe('POST /api/cases/:id/readings', () => {
  it('stores a reading with the level as read and in dBm (IARU Region 1 R.1: S9 = -73 dBm on HF, 6 dB per unit)', async () => {
    const body = reading({ level: { unit: 'S', value: 7 } });
    const r = await api(`/api/cases/${caseA}/readings`, { session: hunter, body });
    expect(r.status, r.text).toBe(201);
    expect(r.json.reading).toMatchObject({ clientId: body.clientId, source: 'walk', level: { unit: 'S', value: 7 }, accuracyM: 5, frequencyKhz: 7100 });
    // S7 on 40 m = -73 - 12 = -85 dBm, less the demo hunter's S-meter offset
    const { s_meter_offset_db } = await db('users').where({ email: 'hunter@example.test' }).first('s_meter_offset_db');
    expect(r.json.reading.levelDbm).toBeCloseTo(-85 - s_meter_offset_db, 6);
    const dbm = await api(`/api/cases/${caseA}/readings`, { session: hunter, body: reading({ level: { unit: 'dBm', value: -61.5 }, takenAt: '2026-12-02T05:11:00Z' }) });
    expect(dbm.status, dbm.text).toBe(201);
    expect(dbm.json.reading.levelDbm).toBeCloseTo(-61.5 - s_meter_offset_db, 6);
  });

  it('refuses bad input with the field named, and writes nothing', async () => {
    const before = await db('level_readings').where({ case_id: caseA }).count<{ count: string }[]>('* as count');
    for (const [over, field] of [
      [{ clientId: 'not-a-uuid' }, 'clientId'],
      [{ lat: 91 }, 'lat'],
      [{ level: { unit: 'S', value: 25 } }, 'level.value'],
      [{ level: { unit: 'dB', value: -60 } }, 'level.unit'],
      [{ takenAt: 'yesterday' }, 'takenAt'],
      [{ accuracyM: -1 }, 'accuracyM'],
    ] as const) {
      const r = await api(`/api/cases/${caseA}/readings`, { session: hunter, body: reading(over) });
      expect(r.status, `${field}: ${r.text}`).toBe(400);
      expect(r.json.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
    const after = await db('level_readings').where({ case_id: caseA }).count<{ count: string }[]>('* as count');
    expect(after).toEqual(before);
  });

  it('the list is in walking order with its smoothed peak; the reporter may not read it', async () => {
    const r = await api(`/api/cases/${caseA}/readings`, { session: coordinator });
    expect(r.status).toBe(200);
    expect(r.json.items.map((i: { takenAt: string }) => i.takenAt)).toEqual(['2026-12-02T05:10:00.000Z', '2026-12-02T05:11:00.000Z']);
    expect(r.json.peak).toMatchObject({ index: expect.any(Number) });
    expect((await api(`/api/cases/${caseA}/readings`, { session: member })).status).toBe(403);
  });

  it('a resolved case refuses new readings with a reason', async () => {
    await db('cases').where({ id: caseB }).update({ status: 'resolved', outcome: 'not-found' });
    const r = await api(`/api/cases/${caseB}/readings`, { session: hunter, body: reading() });
    expect(r.status).toBe(403);
    expect(r.json.error).toMatch(/while it is being hunted/);
    await db('cases').where({ id: caseB }).update({ status: 'open', outcome: null });
  });
});

describe('clientId: a repeat stores nothing new and answers the same body', () => {
  it('readings: the second send is 200 with the same body; racing sends store one row', async () => {
    const body = reading({ takenAt: '2026-12-02T05:12:00Z' });
    const first = await api(`/api/cases/${caseA}/readings`, { session: hunter, body });
    const again = await api(`/api/cases/${caseA}/readings`, { session: hunter, body });
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.json).toEqual(first.json);
    const raced = reading({ takenAt: '2026-12-02T05:13:00Z' });
    const all = await Promise.all([1, 2, 3, 4].map(() => api(`/api/cases/${caseA}/readings`, { session: hunter, body: raced })));
    expect(all.map((r) => r.status).sort()).toEqual([200, 200, 200, 201]);
    expect(await db('level_readings').where({ client_id: raced.clientId }).count<{ count: string }[]>('* as count')).toEqual([{ count: '1' }]);
  });

  it('a clientId already used in another case, or by someone else, is a 409', async () => {
    const body = reading();
    expect((await api(`/api/cases/${caseA}/readings`, { session: hunter, body })).status).toBe(201);
    const other = await api(`/api/cases/${caseB}/readings`, { session: hunter, body });
    expect(other.status).toBe(409);
    expect(other.json.code).toBe('client-id-taken');
    const someoneElse = await api(`/api/cases/${caseA}/readings`, { session: coordinator, body });
    expect(someoneElse.status).toBe(409);
  });

  it('bearings: the repeat is 200 with the same bearing, one row, one fix snapshot', async () => {
    const body = { clientId: randomUUID(), lat: -31.0602, lon: 129.7551, positionSource: 'map', reference: 'true', azimuthDeg: 40, quality: 'sharp' };
    const first = await api(`/api/cases/${caseB}/bearings`, { session: hunter, body });
    expect(first.status, first.text).toBe(201);
    const snapshots = await db('fix_snapshots').where({ case_id: caseB }).count<{ count: string }[]>('* as count');
    const again = await api(`/api/cases/${caseB}/bearings`, { session: hunter, body });
    expect(again.status).toBe(200);
    expect(again.json).toEqual(first.json);
    expect(first.json.bearing.clientId).toBe(body.clientId);
    expect(await db('bearings').where({ client_id: body.clientId }).count<{ count: string }[]>('* as count')).toEqual([{ count: '1' }]);
    expect(await db('fix_snapshots').where({ case_id: caseB }).count<{ count: string }[]>('* as count')).toEqual(snapshots);
    const raced = { ...body, clientId: randomUUID(), azimuthDeg: 300, lat: -31.0561, lon: 129.7632 };
    const all = await Promise.all([1, 2, 3].map(() => api(`/api/cases/${caseB}/bearings`, { session: hunter, body: raced })));
    expect(all.map((r) => r.status).sort()).toEqual([200, 200, 201]);
    expect(await db('bearings').where({ client_id: raced.clientId }).count<{ count: string }[]>('* as count')).toEqual([{ count: '1' }]);
  });

  it('sweeps: the repeat is 200 with the same bearing and the same fitted null', async () => {
    const samples = [0, 20, 40, 60, 80, 100, 120].map((a) => ({ azimuthDeg: a, level: -95 + 25 * Math.abs(Math.sin(((a - 62) * Math.PI) / 180)) }));
    const body = { clientId: randomUUID(), lat: -31.0549, lon: 129.7575, positionSource: 'map', reference: 'true', samples };
    const first = await api(`/api/cases/${caseB}/sweeps`, { session: hunter, body });
    expect(first.status, first.text).toBe(201);
    const again = await api(`/api/cases/${caseB}/sweeps`, { session: hunter, body });
    expect(again.status).toBe(200);
    expect(again.json).toEqual(first.json);
    expect(await db('bearings').where({ client_id: body.clientId }).count<{ count: string }[]>('* as count')).toEqual([{ count: '1' }]);
  });
});
