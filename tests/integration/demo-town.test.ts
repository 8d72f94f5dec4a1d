/**
 * The demo town as `npm start` (and npm test) seeds it: Quillon, our own fiction, about 100
 * numbered houses on a few streets of our own names, laid out so both demo cases' fixes fall
 * among houses: the building holding each made-up source is a candidate inside the 95 % region,
 * and the count of houses inside matches Turf's booleanIntersects over the footprints (Turf 7,
 * from the registry: a reference outside PostGIS), however long the list is.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { bbox, booleanIntersects, feature } from '@turf/turf';
import type { Geometry, Polygon } from 'geojson';
import { db } from '@/db';
import { DEMO_SOURCES } from '@/db/seeds/demo';
import { DEMO_TOWN } from '@/db/seeds/demo-town';
import { api, signIn, type Session } from '../support/http';

const OUR_STREETS = ['Hushbeck Lane', 'Nullbrook Close', 'Ostmere Way', 'Quill Row', 'Sallowmere Road'];
const CASES = [
  { title: 'Rasping hash on 80 m and 40 m in the evenings', source: DEMO_SOURCES.open },
  { title: 'Warbling carriers every 15 kHz across 20 m', source: DEMO_SOURCES.located },
];

let coordinator: Session;
beforeAll(async () => {
  coordinator = await signIn('coordinator@example.test');
});

describe('the demo town', () => {
  it('is our own: 5 streets of our names, 100 numbered houses, every address in Quillon', async () => {
    const rows = await db('places').where({ source: 'demo' }).select('kind', 'name', 'housenumber', 'street', 'postcode', 'city');
    const streets = rows.filter((r) => r.kind === 'street').map((r) => r.name).sort();
    const houses = rows.filter((r) => r.kind === 'building');
    expect(streets).toEqual(OUR_STREETS);
    expect(houses).toHaveLength(100);
    for (const h of houses) {
      expect(h.housenumber).toMatch(/^\d+$/);
      expect(OUR_STREETS).toContain(h.street);
      expect(h).toMatchObject({ postcode: DEMO_TOWN.postcode, city: DEMO_TOWN.city });
    }
    // No two houses share an address.
    expect(new Set(houses.map((h) => `${h.housenumber} ${h.street}`)).size).toBe(100);
  });

  it.each(CASES)('puts houses inside the region of "$title", the one holding its source among them', async ({ title, source }) => {
    const c = await db('cases').where({ title }).orderBy('created_at').first();
    const { rows } = await db.raw(
      `select id from places where source = 'demo' and kind = 'building' and ST_Contains(geom, ST_SetSRID(ST_MakePoint(?, ?), 4326))`,
      [source.lon, source.lat],
    );
    expect(rows, 'the made-up source stands in one demo house').toHaveLength(1);
    const r = await api(`/api/cases/${c.id}/candidates`, { session: coordinator });
    expect(r.status, r.text).toBe(200);
    expect(r.json.insideCount).toBeGreaterThanOrEqual(3);
    const items = r.json.items as { placeId: string; address: string; insideRegion: boolean }[];
    expect(items.find((i) => i.placeId === rows[0].id)).toMatchObject({ insideRegion: true, address: expect.stringMatching(/, QH7 0DM Quillon$/) });

    const region = r.json.region as Polygon;
    const [w, s, e, n] = bbox(region);
    const near = await db.raw(`select ST_AsGeoJSON(geom)::json as g from places where kind = 'building' and geom && ST_MakeEnvelope(?, ?, ?, ?, 4326)`, [w, s, e, n]);
    const byTurf = near.rows.filter((x: { g: Geometry }) => booleanIntersects(feature(x.g), feature(region))).length;
    console.log(`[figure] demo case "${title}": ${r.json.insideCount} houses inside the region (Turf: ${byTurf}), ${items.length} listed${r.json.truncated ? ', list cut short' : ''}`);
    expect(r.json.insideCount).toBe(byTurf);
  });
});
