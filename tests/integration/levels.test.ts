/**
 * The level log: readings in S-units or dBm with bandwidth and phase, each against the expected
 * man-made noise; before/after carried into the resolution. Our own fictional case.
 * Reference: Rec. ITU-R P.372 (man-made noise, Table 1): Fam = c − d·log10(f/MHz) dB above kT0b,
 * residential c = 72.5, d = 27.7; the noise power in bandwidth b is Fam − 174 + 10·log10(b) dBm
 * (−174 dBm/Hz = kT0 at 290 K). S-units: IARU Region 1 Technical Recommendation R.1
 * (S9 = −73 dBm below 30 MHz, 6 dB per S-unit).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { db, inTransaction } from '@/db';
import { insertCase } from '@/db/cases';
import { getUserByEmail } from '@/db/users';
import { api, signIn, type Session } from '../support/http';

let hunter: Session;
let coordinator: Session;
let member: Session;
let caseId: string;

const p372 = (c: number, d: number, fMHz: number, bHz: number) => c - d * Math.log10(fMHz) - 174 + 10 * Math.log10(bHz);

beforeAll(async () => {
  [hunter, coordinator, member] = await Promise.all([signIn('hunter@example.test'), signIn('coordinator@example.test'), signIn('member@example.test')]);
  const [m, h] = await Promise.all([getUserByEmail('member@example.test'), getUserByEmail('hunter@example.test')]);
  caseId = await inTransaction(async (trx) => (await insertCase(trx, { title: 'Level log test', description: '', reporterId: m!.id, reportedLat: -31.058, reportedLon: 129.759, bands: ['40m'], assigneeId: h!.id })).id);
});

afterAll(async () => {
  await db('club_settings').where({ id: 1 }).update({ noise_environment: 'residential' });
  await db('cases').where({ id: caseId }).del();
});

const reading = (over: Record<string, unknown> = {}) => ({ frequencyKhz: 7100, level: { unit: 'S', value: 7 }, bandwidthHz: 2400, takenAt: new Date(Date.now() - 3_600_000).toISOString(), phase: 'before', ...over });

describe('the level log', () => {
  it('S7 at 7.1 MHz in 2.4 kHz: −85 dBm, the residential floor by P.372, and the excess', async () => {
    const r = await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading() });
    expect(r.status, r.text).toBe(201);
    const expected = p372(72.5, 27.7, 7.1, 2400); // −91.28 dBm
    expect(r.json.item.levelDbm).toBe(-85);
    expect(r.json.item.expectedDbm).toBeCloseTo(expected, 1);
    expect(r.json.item.excessDb).toBeCloseTo(-85 - expected, 1);
    console.log(`[levels] S7 at 7100 kHz, 2400 Hz: ${r.json.item.levelDbm} dBm, expected ${r.json.item.expectedDbm} dBm (formula ${expected.toFixed(2)}), excess ${r.json.item.excessDb} dB`);
  });

  it('the club environment changes the floor (rural c = 67.2), dBm readings are kept as given', async () => {
    await db('club_settings').where({ id: 1 }).update({ noise_environment: 'rural' });
    const r = await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading({ frequencyKhz: 14200, level: { unit: 'dBm', value: -97.5 }, bandwidthHz: 500 }) });
    expect(r.status, r.text).toBe(201);
    expect(r.json.item.expectedDbm).toBeCloseTo(p372(67.2, 27.7, 14.2, 500), 1);
    expect(r.json.item.levelDbm).toBe(-97.5);
    await db('club_settings').where({ id: 1 }).update({ noise_environment: 'residential' });
  });

  it('a repeated clientId stores one reading; bad input names the field; the reporter may not read or write', async () => {
    const clientId = randomUUID();
    const a = await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading({ clientId, phase: 'before', level: { unit: 'S', value: 8 } }) });
    const b = await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading({ clientId, phase: 'before', level: { unit: 'S', value: 8 } }) });
    expect([a.status, b.status]).toEqual([201, 200]);
    expect(b.json.item.id).toBe(a.json.item.id);
    const bad = await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading({ level: { unit: 'S', value: 12 }, phase: 'during' }) });
    expect(bad.status).toBe(400);
    expect(bad.json.issues.map((i: { path: string }) => i.path).sort()).toEqual(['level.value', 'phase']);
    expect((await api(`/api/cases/${caseId}/levels`, { session: member })).status).toBe(403);
    expect((await api(`/api/cases/${caseId}/levels`, { session: member, body: reading() })).status).toBe(403);
  });

  it('before and after on one frequency: the medians and their difference go into the resolution', async () => {
    for (const v of [-100, -102]) await api(`/api/cases/${caseId}/levels`, { session: hunter, body: reading({ level: { unit: 'dBm', value: v }, phase: 'after', takenAt: new Date().toISOString() }) });
    const log = await api(`/api/cases/${caseId}/levels`, { session: coordinator });
    // before at 7100 kHz: S7 (−85) and S8 (−79) -> median −82; after −100, −102 -> −101
    expect(log.json.beforeAfter).toEqual({ frequencyKhz: 7100, beforeDbm: -82, afterDbm: -101, differenceDb: -19, readings: 4 });
    const c = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
    const t = await api(`/api/cases/${caseId}/transitions`, { session: coordinator, body: { to: 'resolved', version: c.version, outcome: 'fixed-by-owner' } });
    expect(t.status, t.text).toBe(200);
    const after = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
    expect([after.levelBeforeDbm, after.levelAfterDbm]).toEqual([-82, -101]);
  });
});
