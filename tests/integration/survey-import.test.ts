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

  it('a dry run answers counts, time span, strongest reading and peak, and writes nothing (rows counted in the database)', async () => {
    const count = async () => Number((await db('level_readings').where({ case_id: caseId }).count<{ n: string }[]>({ n: '*' }))[0].n);
    const before = await count();
    const csv = ['time,level,unit', `${iso(21)},5,S`, `${iso(49)},8,S`, `${iso(61)},-95,dBm`, `${iso(300)},9,S`].join('\n');
    const r = await api(`/api/cases/${caseId}/readings/import?dryRun=1`, { session: hunter, body: { gpx: gpxOf(walk), csv, toleranceS: 5, frequencyKhz: 7100 } });
    expect(r.status, r.text).toBe(200);
    expect(r.json).toMatchObject({ dryRun: true, ok: true, points: 3, unmatchedCsvRows: [5], toleranceS: 5, problems: [] });
    // The levels' own times (not the track points'): 21 s to 61 s after the start.
    expect(r.json.span).toEqual({ from: iso(21), to: iso(61) });
    // S8 at 7.1 MHz is S9 - 6 dB = -79 dBm (IARU Region 1 R.1: S9 = -73 dBm below 30 MHz, 6 dB per S-unit), louder than S5 and -95 dBm;
    // the demo hunter has no S-meter offset. It joins the track point 50 s in (walk[5]), the nearest in time to 49 s.
    expect(r.json.strongest).toMatchObject({ lat: walk[5].lat, lon: walk[5].lon, level: { unit: 'S', value: 8 }, takenAt: iso(49) });
    expect(r.json.strongest.levelDbm).toBeCloseTo(-79, 6);
    expect(r.json.peak).not.toBeNull();
    expect(await count()).toBe(before);
  });

  it('a dry run lists every bad CSV row and GPX point by row and line, writing nothing; the import then refuses with the same list', async () => {
    const count = async () => Number((await db('level_readings').where({ case_id: caseId }).count<{ n: string }[]>({ n: '*' }))[0].n);
    const before = await count();
    const gpx = gpxOf(walk).replace(`<time>${iso(30)}</time>`, '');
    const body = { gpx, csv: `time,level,unit\n${iso(10)},5,S\n${iso(20)},loud,S\nnoon,4,S\n${iso(40)},6,volts` };
    const dry = await api(`/api/cases/${caseId}/readings/import?dryRun=1`, { session: hunter, body });
    expect(dry.status, dry.text).toBe(200);
    expect(dry.json.ok).toBe(false);
    expect(dry.json.problemCount).toBe(4);
    const where = dry.json.problems.map((p: { file: string; line?: number; row?: number }) => `${p.file}:${p.line ?? p.row}`);
    // Track point 4 is on line 7 of gpxOf's layout (XML declaration, <gpx>, <trk>, then one point a line).
    expect(where).toEqual(['gpx:7', 'csv:3', 'csv:4', 'csv:5']);
    expect(dry.json.problems[0].message).toMatch(/Track point 4 \(line 7\) has no <time>/);
    expect(dry.json.problems[3].message).toMatch(/CSV row 5: the unit "volts" is neither S nor dBm/);
    const real = await api(`/api/cases/${caseId}/readings/import`, { session: hunter, body });
    expect(real.status).toBe(400);
    expect(real.json.error).toMatch(/Track point 4 .* \(4 problems in all; nothing was imported\)/);
    expect(real.json.problems).toHaveLength(4);
    expect(await count()).toBe(before);
  });

  it('a dry run of a GPX that is not XML answers the parser\'s plain message', async () => {
    const r = await api(`/api/cases/${caseId}/readings/import?dryRun=1`, { session: hunter, body: { gpx: 'lat,lon,time\n-31.05,129.75,2026-11-30T14:00:00Z' } });
    expect(r.status).toBe(200);
    expect(r.json).toMatchObject({ ok: false, problemCount: 1 });
    expect(r.json.problems[0]).toMatchObject({ file: 'gpx' });
    expect(r.json.problems[0].message).toMatch(/^The GPX is not well-formed XML/);
  });
});

