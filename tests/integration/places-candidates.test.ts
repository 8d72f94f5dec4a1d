/**
 * Candidates, the places endpoint and the 500 m duplicate check, against references outside
 * PostGIS: GeographicLib geodesics (Karney 2013, "Algorithms for geodesics", J. Geodesy 87;
 * the geographiclib-geodesic package) and a brute-force point-in-ellipse test over each footprint.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as geographiclib from 'geographiclib-geodesic';
import type { Knex } from 'knex';
import { db, inTransaction } from '@/db';
import { findNearbyOpenCase, insertCase } from '@/db/cases';
import { insertFixSnapshot } from '@/db/fixes';
import { upsertPlaces, type PlaceInput } from '@/db/places';
import { getUserByEmail } from '@/db/users';
import type { Fix } from '@/lib/df';
import { caseCandidates } from '@/lib/hunt/candidates';
import { PLACES_CAP } from '@/lib/validation/places';
import { api, signIn, type Session } from '../support/http';

type GL = typeof geographiclib;
const G: GL = (geographiclib as GL & { default?: GL }).default?.Geodesic ? (geographiclib as { default?: GL }).default! : geographiclib;
const WGS84 = G.Geodesic.WGS84;
const direct = (lat: number, lon: number, azi: number, s: number) => {
  const r = WGS84.Direct(lat, lon, azi, s);
  return { lat: r.lat2!, lon: r.lon2! };
};
/** East/north metres of a point from the centre along the geodesic (GeographicLib Inverse). */
const eastNorth = (c: { lat: number; lon: number }, lat: number, lon: number): [number, number] => {
  const r = WGS84.Inverse(c.lat, c.lon, lat, lon);
  const a = (r.azi1! * Math.PI) / 180;
  return [r.s12! * Math.sin(a), r.s12! * Math.cos(a)];
};

const SOURCE = `test-candidates-${process.pid}`;
// A constructed fix on open land, away from the demo town: 95 % ellipse 90 m x 40 m, major axis at 35°.
const CENTRE = { lat: -31.31, lon: 129.52 };
const ELLIPSE = { semiMajorM: 90, semiMinorM: 40, majorAxisAzimuthDeg: 35, confidence: 0.95 };
const K95 = Math.sqrt(-2 * Math.log(1 - 0.95)); // chi-square, 2 degrees of freedom

/** Mahalanobis distance of an east/north offset under the constructed ellipse. */
function mahalanobis([e, n]: [number, number]): number {
  const az = (ELLIPSE.majorAxisAzimuthDeg * Math.PI) / 180;
  const u = e * Math.sin(az) + n * Math.cos(az);
  const v = e * Math.cos(az) - n * Math.sin(az);
  return Math.hypot(u / (ELLIPSE.semiMajorM / K95), v / (ELLIPSE.semiMinorM / K95));
}

/** Footprints: 11 m x 9 m houses on a 17 m grid over 340 m x 340 m, each corner placed by GeographicLib Direct. */
function footprints(): (PlaceInput & { corners: [number, number][] })[] {
  const out: (PlaceInput & { corners: [number, number][] })[] = [];
  for (let i = -10; i <= 10; i++)
    for (let j = -10; j <= 10; j++) {
      const e0 = i * 17 + 3; // offset so the centre is not on a corner
      const n0 = j * 17 + 2;
      const corners: [number, number][] = [[e0, n0], [e0 + 11, n0], [e0 + 11, n0 + 9], [e0, n0 + 9]];
      const ring = [...corners, corners[0]].map(([e, n]) => {
        const p = direct(CENTRE.lat, CENTRE.lon, (Math.atan2(e, n) * 180) / Math.PI, Math.hypot(e, n));
        return [p.lon, p.lat];
      });
      out.push({ source: SOURCE, sourceId: `${i},${j}`, kind: 'building', housenumber: `${i + 11}-${j + 11}`, street: 'Test Grid Way', geometry: { type: 'Polygon', coordinates: [ring] }, corners });
    }
  return out;
}

/** Brute force: minimum Mahalanobis distance over the footprint, sampled every 0.25 m (east/north by GeographicLib). */
function bruteForceMin(ring: number[][]): number {
  let best = Infinity;
  const pts = ring.slice(0, 4).map(([lon, lat]) => eastNorth(CENTRE, lat, lon));
  // the footprint is a parallelogram in the local plane to well under a millimetre at this size
  const [p0, p1, , p3] = pts;
  const steps = 48;
  for (let a = 0; a <= steps; a++)
    for (let b = 0; b <= steps; b++) {
      const e = p0[0] + ((p1[0] - p0[0]) * a) / steps + ((p3[0] - p0[0]) * b) / steps;
      const n = p0[1] + ((p1[1] - p0[1]) * a) / steps + ((p3[1] - p0[1]) * b) / steps;
      best = Math.min(best, mahalanobis([e, n]));
    }
  return best;
}

let admin: Session;
let member: Session;
let hunter: Session;
let caseId: string;
const places = footprints();

beforeAll(async () => {
  [admin, member, hunter] = await Promise.all([signIn('chair@example.test'), signIn('member@example.test'), signIn('hunter@example.test')]);
  const reporter = await getUserByEmail('member@example.test');
  await inTransaction(async (trx) => {
    await upsertPlaces(trx, places);
    const c = await insertCase(trx, { title: 'Constructed fix for candidates', description: '', reporterId: reporter!.id, reportedLat: CENTRE.lat, reportedLon: CENTRE.lon, bands: ['test-band'] });
    caseId = c.id;
    const fix: Fix = { ok: true, lat: CENTRE.lat, lon: CENTRE.lon, ellipse: ELLIPSE, residuals: [], outlierIds: [], intersections: [], warnings: [], notices: [], varianceFactor: 1 };
    await insertFixSnapshot(trx, caseId, 'constructed', 3, fix);
  });
});

afterAll(async () => {
  await db('cases').where({ id: caseId }).del();
  await db('places').where({ source: SOURCE }).del();
});

describe('GET /api/cases/:id/candidates', () => {
  it('lists the footprints meeting the 95 % ellipse: the same set as a brute-force point-in-ellipse test, most likely first', async () => {
    const t0 = performance.now();
    const r = await api(`/api/cases/${caseId}/candidates`, { session: admin });
    const ms = Math.round(performance.now() - t0);
    expect(r.status, r.text).toBe(200);
    const byId = new Map<string, { insideRegion: boolean; likelihood: number }>(r.json.items.map((i: { placeId: string }) => [i.placeId, i]));
    const rows = await db('places').where({ source: SOURCE }).select('id', 'source_id');
    const idOf = new Map(rows.map((x) => [x.source_id as string, x.id as string]));
    let agree = 0;
    let boundary = 0;
    let inside = 0;
    let near = 0; // within 5 % of the boundary: where a wrong region or metric would show first
    const ranked: { id: string; d: number }[] = [];
    for (const p of places) {
      const d = bruteForceMin((p.geometry as { coordinates: number[][][] }).coordinates[0]);
      const id = idOf.get(p.sourceId)!;
      const got = byId.get(id);
      // The region is a 72-point polygon inscribed in the ellipse (radial shortfall under 0.1 %),
      // and the brute force samples every ~0.25 m: within 0.5 % of the boundary either answer is right.
      if (Math.abs(d - K95) / K95 < 0.005) {
        boundary++;
        continue;
      }
      if (Math.abs(d - K95) / K95 < 0.05) near++;
      const expectInside = d <= K95;
      if (expectInside) inside++;
      if ((got?.insideRegion ?? false) === expectInside) agree++;
      else console.log('disagree', p.sourceId, d, got);
      if (got) {
        ranked.push({ id, d });
        // likelihood is exp(-d²/2) at the footprint's nearest point
        expect(got.likelihood).toBeCloseTo(Math.exp(-(d * d) / 2), 2);
      }
    }
    console.log(`[figure] candidates: ${agree}/${places.length - boundary} footprints agree with the brute force (${boundary} within 0.5 % of the boundary left out, ${near} within 5 %); ${inside} inside; ${ms} ms for the request`);
    expect(agree).toBe(places.length - boundary);
    expect(inside).toBeGreaterThan(20);
    expect(r.json.insideCount).toBe(inside + r.json.items.filter((i: { insideRegion: boolean; placeId: string }) => i.insideRegion && !ranked.some((x) => x.id === i.placeId)).length);
    // Most likely first: the list's order matches the brute-force distances (ties aside).
    const order = r.json.items.map((i: { placeId: string }) => ranked.find((x) => x.id === i.placeId)?.d).filter((d: number | undefined) => d !== undefined);
    for (let k = 1; k < order.length; k++) expect(order[k]).toBeGreaterThanOrEqual(order[k - 1] - 1e-3);
    expect(r.json.items[0]).toEqual(expect.objectContaining({ address: expect.stringMatching(/Test Grid Way/), insideRegion: true }));

    // A list cut short still counts every building in the region, and says it was cut.
    const short = await caseCandidates(caseId, db, 10);
    expect(short.items.map((i) => i.placeId)).toEqual(r.json.items.slice(0, 10).map((i: { placeId: string }) => i.placeId));
    expect(short.truncated).toBe(true);
    expect(short.insideCount).toBe(r.json.insideCount);
    expect(short.insideCount).toBeGreaterThanOrEqual(inside);
    expect(short.insideCount).toBeLessThanOrEqual(inside + boundary);
  });

  it('is for the committee and the assigned hunter only', async () => {
    expect((await api(`/api/cases/${caseId}/candidates`, { session: member })).status).toBe(403); // the reporter: never the houses
    expect((await api(`/api/cases/${caseId}/candidates`, { session: hunter })).status).toBe(404); // not assigned
    expect((await api(`/api/cases/${caseId}/candidates`)).status).toBe(401);
  });
});

describe('GET /api/places', () => {
  const box = (c: { lat: number; lon: number }, halfDeg: number) => `${c.lon - halfDeg},${c.lat - halfDeg},${c.lon + halfDeg},${c.lat + halfDeg}`;

  it('answers the streets and buildings in the box as a GeoJSON FeatureCollection', async () => {
    // a box of about 110 m a side around the centre: only the footprints that meet it
    const half = 0.0005;
    const t0 = performance.now();
    const r = await api(`/api/places?bbox=${box(CENTRE, half)}`, { session: hunter });
    const ms = Math.round(performance.now() - t0);
    expect(r.status, r.text).toBe(200);
    expect(r.json.type).toBe('FeatureCollection');
    const mine = r.json.features.filter((f: { properties: { street: string } }) => f.properties.street === 'Test Grid Way');
    const expected = places.filter((p) => {
      const xs = (p.geometry as { coordinates: number[][][] }).coordinates[0];
      return xs.some(([lon]) => lon >= CENTRE.lon - half) && xs.some(([lon]) => lon <= CENTRE.lon + half) && xs.some(([, lat]) => lat >= CENTRE.lat - half) && xs.some(([, lat]) => lat <= CENTRE.lat + half);
    });
    expect(mine.length).toBe(expected.length);
    expect(mine[0]).toMatchObject({ type: 'Feature', geometry: { type: 'Polygon' }, properties: { kind: 'building', address: expect.stringMatching(/Test Grid Way/) } });
    console.log(`[figure] /api/places: ${r.json.features.length} features for a ~110 m box in ${ms} ms`);
  });

  it('caps the answer and says so', async () => {
    // 441 footprints here; the cap is PLACES_CAP — make the box hold more than the cap by loading a dense block
    const extra: PlaceInput[] = [];
    for (let i = 0; i < PLACES_CAP + 10; i++) {
      const lon = CENTRE.lon + 0.004 + (i % 60) * 0.00005;
      const lat = CENTRE.lat + 0.004 + Math.floor(i / 60) * 0.00005;
      extra.push({ source: SOURCE, sourceId: `dense-${i}`, kind: 'building', geometry: { type: 'Polygon', coordinates: [[[lon, lat], [lon + 0.00003, lat], [lon + 0.00003, lat + 0.00003], [lon, lat + 0.00003], [lon, lat]]] } });
    }
    await inTransaction((trx: Knex.Transaction) => upsertPlaces(trx, extra).then(() => undefined));
    const t0 = performance.now();
    const r = await api(`/api/places?bbox=${box({ lat: CENTRE.lat + 0.0045, lon: CENTRE.lon + 0.0045 }, 0.003)}`, { session: admin });
    const ms = Math.round(performance.now() - t0);
    expect(r.status).toBe(200);
    expect(r.json.features.length).toBe(PLACES_CAP);
    expect(r.json.truncated).toBe(true);
    console.log(`[figure] /api/places at the cap: ${PLACES_CAP} features in ${ms} ms (${Math.round(r.text.length / 1024)} KiB)`);
  });

  it('refuses a bad or too large box with a plain 400, and members and signed-out callers', async () => {
    for (const bbox of ['1,2,3', '10,0,5,1', 'a,b,c,d', '129,-31.5,129.5,-31']) {
      const r = await api(`/api/places?bbox=${bbox}`, { session: admin });
      expect(r.status, bbox).toBe(400);
      expect(r.json.issues[0].message).toMatch(/bbox/);
    }
    expect((await api(`/api/places?bbox=${box(CENTRE, 0.001)}`, { session: member })).status).toBe(403);
    expect((await api(`/api/places?bbox=${box(CENTRE, 0.001)}`)).status).toBe(401);
  });
});

describe('500 m duplicate check (ST_DWithin on the WGS84 ellipsoid)', () => {
  it('agrees with GeographicLib distances on both sides of 500 m, where a 6371 km sphere would not', async () => {
    const anchorAt = { lat: -31.42, lon: 129.33 };
    const reporter = await getUserByEmail('member@example.test');
    const probes = [
      // At 31° S a metre north is 1/6,347,000 rad of latitude, so a sphere of 6371 km reads 498.5 m as ~500.4 m.
      { azi: 0, s: 498.5, band: 'p1', near: true },
      { azi: 90, s: 498.5, band: 'p2', near: true },
      { azi: 90, s: 501.5, band: 'p3', near: false },
      { azi: 180, s: 501, band: 'p4', near: false },
      { azi: 225, s: 499.5, band: 'p5', near: true },
      { azi: 300, s: 500.5, band: 'p6', near: false },
    ];
    const anchor = await inTransaction((trx) =>
      insertCase(trx, { title: 'Duplicate check anchor', description: '', reporterId: reporter!.id, reportedLat: anchorAt.lat, reportedLon: anchorAt.lon, bands: probes.map((p) => p.band) }),
    );
    try {
      for (const p of probes) {
        const at = direct(anchorAt.lat, anchorAt.lon, p.azi, p.s);
        const check = WGS84.Inverse(anchorAt.lat, anchorAt.lon, at.lat, at.lon).s12!;
        expect(check).toBeCloseTo(p.s, 6);
        const hit = await findNearbyOpenCase(db, { ...at, bands: [p.band], radiusM: 500 });
        expect(hit?.id === anchor.id, `${p.s} m at ${p.azi}°`).toBe(p.near);
      }
      // The GiST index on reported_geog can serve the check.
      const plan = await db.transaction(async (trx) => {
        await trx.raw('set local enable_seqscan = off');
        const { rows } = await trx.raw(
          "explain select id from cases where ST_DWithin(reported_geog, geography(ST_SetSRID(ST_MakePoint(?, ?), 4326)), 500)",
          [anchorAt.lon, anchorAt.lat],
        );
        return rows.map((x: { 'QUERY PLAN': string }) => x['QUERY PLAN']).join('\n');
      });
      expect(plan).toMatch(/cases_reported_geog_gist/);
    } finally {
      await db('cases').where({ id: anchor.id }).del();
    }
  });
});
