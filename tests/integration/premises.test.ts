/**
 * Confirmed premises: a hunter picks a building (or a point) and says how; the committee sees it;
 * the located transition accepts it as evidence; the notice composer's household warning
 * recognises the same building however its address is spelled. Our own fictional cases.
 */
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
let placeId: string;

beforeAll(async () => {
  [hunter, coordinator, member] = await Promise.all([signIn('hunter@example.test'), signIn('coordinator@example.test'), signIn('member@example.test')]);
  const [m, h] = await Promise.all([getUserByEmail('member@example.test'), getUserByEmail('hunter@example.test')]);
  const place = await db('places').where({ source: 'demo', street: 'Nullbrook Close', housenumber: '7' }).first();
  placeId = place.id;
  await inTransaction(async (trx) => {
    const base = { description: '', reporterId: m!.id, reportedLat: -31.058, reportedLon: 129.759, bands: ['15m'], assigneeId: h!.id };
    caseA = (await insertCase(trx, { ...base, title: 'Premises test A' })).id;
    caseB = (await insertCase(trx, { ...base, title: 'Premises test B' })).id;
  });
});

afterAll(async () => {
  await db('cases').whereIn('id', [caseA, caseB]).del();
});

describe('PUT /api/cases/:id/premises', () => {
  it('stores a picked building with its address, who and how; the committee reads it, the reporter may not', async () => {
    const r = await api(`/api/cases/${caseA}/premises`, { method: 'PUT', session: hunter, body: { placeId, how: 'level-peak', note: 'Peak at the gate.' } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.premises).toMatchObject({ placeId, address: '7 Nullbrook Close, QH7 0DM Quillon', how: 'level-peak', note: 'Peak at the gate.', confirmedBy: { name: 'Cleo Marchetti' } });
    expect(r.json.premises.lat).toBeCloseTo(-31.058, 2);
    const seen = await api(`/api/cases/${caseA}/premises`, { session: coordinator });
    expect(seen.json.premises.address).toBe('7 Nullbrook Close, QH7 0DM Quillon');
    expect((await api(`/api/cases/${caseA}/premises`, { session: member })).status).toBe(403);
    // the timeline entry is committee-only and counts as the confirmation a coordinator locates by
    const c = (await api(`/api/cases/${caseA}`, { session: coordinator })).json;
    const t = await api(`/api/cases/${caseA}/transitions`, { session: coordinator, body: { to: 'located', version: c.version, evidence: 'premises', note: '' } });
    expect(t.status, t.text).toBe(200);
    const memberEvents = (await api(`/api/cases/${caseA}/events`, { session: member })).json.items;
    expect(JSON.stringify(memberEvents)).not.toContain('Nullbrook');
  });

  it('takes a point and a typed address when the building is not in the places layer; refuses incomplete input', async () => {
    let r = await api(`/api/cases/${caseB}/premises`, { method: 'PUT', session: hunter, body: { how: 'switch-off-test' } });
    expect(r.status).toBe(400);
    expect(r.json.issues.map((i: { path: string }) => i.path).sort()).toEqual(['address', 'lat']);
    r = await api(`/api/cases/${caseB}/premises`, { method: 'PUT', session: hunter, body: { placeId: '00000000-0000-4000-8000-000000000000', how: 'level-peak' } });
    expect(r.status).toBe(400);
    expect(r.json.error).toMatch(/No such building/);
    r = await api(`/api/cases/${caseB}/premises`, { method: 'PUT', session: hunter, body: { how: 'teleport', address: 'x', lat: 1, lon: 1 } });
    expect(r.status).toBe(400);
    r = await api(`/api/cases/${caseB}/premises`, { method: 'PUT', session: hunter, body: { address: 'Shed behind 7 Nullbrook Close, Quillon', lat: -31.05805, lon: 129.75905, how: 'switch-off-test' } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.premises).toMatchObject({ placeId: null, address: 'Shed behind 7 Nullbrook Close, Quillon', how: 'switch-off-test' });
  });

  it('warns about a notice to the same building on another case, whatever the spelling', async () => {
    // Case B's premises move to the same building as case A's; A gets a notice.
    await api(`/api/cases/${caseB}/premises`, { method: 'PUT', session: hunter, body: { placeId, how: 'level-peak' } });
    const n = await api(`/api/cases/${caseA}/notices`, { session: coordinator, body: { templateKey: 'first-notice', recipientName: 'The householder', postalAddress: 'Number Seven, Nullbrook Cl., Quillon' } });
    expect(n.status, n.text).toBe(201);
    const list = await api(`/api/cases/${caseB}/notices?address=${encodeURIComponent('7 Nullbrook Close\nQH7 0DM Quillon')}`, { session: coordinator });
    expect(list.status).toBe(200);
    expect(list.json.sameAddressElsewhere.map((x: { caseId: string }) => x.caseId)).toEqual([caseA]);
  });
});
