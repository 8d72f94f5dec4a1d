/** A walked survey imported from GPX + CSV into the case's one trail table (level_readings, source 'gpx'). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, inTransaction } from '@/db';
import { insertCase } from '@/db/cases';
import { getUserByEmail } from '@/db/users';
import { api, signIn, type Session } from '../support/http';
import { gpxOf, iso, walk } from '../support/survey';

let hunter: Session;
let caseId: string;

beforeAll(async () => {
  hunter = await signIn('hunter@example.test');
  const [m, h] = await Promise.all([getUserByEmail('member@example.test'), getUserByEmail('hunter@example.test')]);
  caseId = await inTransaction(async (trx) => (await insertCase(trx, { title: 'Survey import test', description: '', reporterId: m!.id, reportedLat: -31.05, reportedLon: 129.75, bands: ['40m'], assigneeId: h!.id })).id);
});
afterAll(async () => {
  await db('cases').where({ id: caseId }).del();
});

describe('POST /api/cases/:id/readings/import', () => {
  it('joins the CSV to the track within the tolerance, stores the points in the trail and names the strongest', async () => {
    const csv = ['time,level,unit', `${iso(21)},5,S`, `${iso(49)},8,S`, `${iso(61)},-95,dBm`, `${iso(300)},9,S`].join('\n');
    const r = await api(`/api/cases/${caseId}/readings/import`, { session: hunter, body: { gpx: gpxOf(walk), csv, toleranceS: 5, frequencyKhz: 7100 } });
    expect(r.status, r.text).toBe(201);
    expect(r.json).toMatchObject({ imported: 3, unmatchedCsvRows: [5], toleranceS: 5 });
    const trail = (await api(`/api/cases/${caseId}/readings`, { session: hunter })).json;
    expect(trail.items).toHaveLength(3);
    const dbm = trail.items.map((i: { levelDbm: number }) => i.levelDbm);
    // S5 and S8 at 7.1 MHz are 18 dB apart (IARU Region 1 R.1, 6 dB per S-unit, whatever the hunter's S-meter offset); S8 is the strongest
    expect(dbm[1] - dbm[0]).toBeCloseTo(18, 5);
    expect(Math.max(...dbm)).toBe(dbm[1]);
    expect(trail.peak).not.toBeNull();
  });

  it('a GPX that is not XML, or a bad CSV row, is refused naming where, and nothing is stored', async () => {
    const before = await db('level_readings').where({ case_id: caseId }).count<{ n: string }[]>({ n: '*' });
    const bad = await api(`/api/cases/${caseId}/readings/import`, { session: hunter, body: { gpx: '<gpx>\n<trk><trkpt lat="1" lon="2"></trk></gpx>' } });
    expect(bad.status).toBe(400);
    expect(bad.json.error).toMatch(/not well-formed XML at line 2/);
    const row = await api(`/api/cases/${caseId}/readings/import`, { session: hunter, body: { gpx: gpxOf(walk), csv: `time,level\n${iso(10)},5\n${iso(20)},loud` } });
    expect(row.status).toBe(400);
    expect(row.json.error).toMatch(/CSV row 3: the level "loud" is not a number/);
    const after = await db('level_readings').where({ case_id: caseId }).count<{ n: string }[]>({ n: '*' });
    expect(after[0].n).toBe(before[0].n);
  });
});
