/**
 * places:import: GeoJSON (RFC 7946) and OpenStreetMap XML files made here, our own fictional
 * data on open land; re-import is idempotent; a bad file names the line or feature at fault and
 * imports nothing. The command itself runs as a child process against the test database.
 */
import { execFile } from 'node:child_process';
import { mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { db, inTransaction } from '@/db';
import { countPlaces } from '@/db/places';
import { importPlaceFile } from '@/lib/places/import-places';
import { api, signIn } from '../support/http';

const run = promisify(execFile);
const SOURCE = `test-import-${process.pid}`;
// Open land, away from the demo town (fictional streets, made-up numbers).
const LON0 = 129.61;
const LAT0 = -31.21;

/** A square footprint of `sizeDeg` with its south-west corner at (lon, lat), closed ring. */
function square(lon: number, lat: number, sizeDeg = 0.0001): number[][][] {
  return [[[lon, lat], [lon + sizeDeg, lat], [lon + sizeDeg, lat + sizeDeg], [lon, lat + sizeDeg], [lon, lat]]];
}

function geojsonTown(houses: number, numberOffset = 0) {
  const features: unknown[] = [
    { type: 'Feature', id: 'st-1', properties: { kind: 'street', name: 'Test Wharrow Lane' }, geometry: { type: 'LineString', coordinates: [[LON0, LAT0 - 0.0001], [LON0 + 0.01, LAT0 - 0.0001]] } },
    { type: 'Feature', properties: { amenity: 'bench' }, geometry: { type: 'Point', coordinates: [LON0, LAT0] } },
  ];
  for (let i = 0; i < houses; i++) {
    features.push({
      type: 'Feature',
      id: `h-${i}`,
      properties: { building: 'house', 'addr:housenumber': String(i + 1 + numberOffset), 'addr:street': 'Test Wharrow Lane', 'addr:postcode': 'QT1 1XX', 'addr:city': 'Testmere' },
      geometry: { type: 'Polygon', coordinates: square(LON0 + i * 0.0002, LAT0) },
    });
  }
  return { type: 'FeatureCollection', features };
}

async function cli(file: string, ...args: string[]): Promise<{ code: number; out: string; err: string }> {
  try {
    const r = await run(process.execPath, ['--import', 'tsx', 'scripts/places-import.ts', file, ...args], { env: process.env });
    return { code: 0, out: r.stdout, err: r.stderr };
  } catch (e) {
    const x = e as { code: number; stdout: string; stderr: string };
    return { code: x.code, out: x.stdout, err: x.stderr };
  }
}

let dir: string;
const file = async (name: string, body: string) => {
  dir ??= await mkdtemp(join(tmpdir(), 'quietfix-places-'));
  const p = join(dir, name);
  await writeFile(p, body);
  return p;
};

afterAll(async () => {
  await db('places').whereIn('source', [SOURCE, 'osm']).del();
});

describe('places:import with GeoJSON', () => {
  it('imports buildings and streets, skips other features, and a re-import updates instead of duplicating', async () => {
    const p = await file('town.geojson', JSON.stringify(geojsonTown(40)));
    const t0 = performance.now();
    const first = await cli(p, '--source', SOURCE);
    const ms = Math.round(performance.now() - t0);
    expect(first.code, first.err).toBe(0);
    expect(first.out).toMatch(/41 new, 0 updated, 1 skipped/);
    console.log(`[figure] places:import of 41 features (CLI, incl. tsx start-up): ${ms} ms`);
    expect(await countPlaces(SOURCE)).toEqual({ buildings: 40, streets: 1, numbered: 40 });

    // Same ids, new house numbers: updated in place.
    const again = await cli(await file('town2.geojson', JSON.stringify(geojsonTown(40, 100))), '--source', SOURCE);
    expect(again.code, again.err).toBe(0);
    expect(again.out).toMatch(/0 new, 41 updated/);
    expect(await countPlaces(SOURCE)).toEqual({ buildings: 40, streets: 1, numbered: 40 });
    const h0 = await db('places').where({ source: SOURCE, source_id: 'h-0' }).first();
    expect(h0.housenumber).toBe('101');
    expect(h0.city).toBe('Testmere');
  });

  it('a feature without an id keeps a stable key (its geometry): importing it twice adds it once', async () => {
    const noId = JSON.stringify({ type: 'Feature', properties: { building: 'yes' }, geometry: { type: 'Polygon', coordinates: square(LON0, LAT0 + 0.001) } });
    for (let i = 0; i < 2; i++) await inTransaction((trx) => importPlaceFile(trx, 'one.geojson', noId, SOURCE));
    expect((await countPlaces(SOURCE)).buildings).toBe(41);
  });

  it('takes positions with an altitude (RFC 7946 section 3.1.1 allows a third number) and keeps them flat', async () => {
    const ring = square(LON0, LAT0 + 0.0005)[0].map(([lon, lat]) => [lon, lat, 12.5]);
    const withAlt = JSON.stringify({ type: 'Feature', id: 'alt-1', properties: { building: 'yes', 'addr:housenumber': '9' }, geometry: { type: 'Polygon', coordinates: [ring] } });
    const r = await cli(await file('alt.geojson', withAlt), '--source', SOURCE);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/1 new/);
    const { rows } = await db.raw('select ST_NDims(geom) as dims from places where source = ? and source_id = ?', [SOURCE, 'alt-1']);
    expect(rows).toEqual([{ dims: 2 }]);
    await db('places').where({ source: SOURCE, source_id: 'alt-1' }).del();
  });

  it('refuses bad files with the line or feature named, importing nothing', async () => {
    const before = await countPlaces(SOURCE);
    const town = geojsonTown(5, 500) as { features: { geometry: { coordinates: number[][][] } }[] };
    // 1. an unclosed ring in the 4th feature
    const open = structuredClone(town);
    open.features[3].geometry.coordinates[0].pop();
    let r = await cli(await file('open.geojson', JSON.stringify(open)), '--source', SOURCE);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/feature 4 \(id "h-1"\): ring 1 is not closed/);
    // 2. latitude and longitude swapped
    const swapped = structuredClone(town);
    swapped.features[2].geometry.coordinates[0] = swapped.features[2].geometry.coordinates[0].map(([x, y]) => [y, x]);
    r = await cli(await file('swapped.geojson', JSON.stringify(swapped)), '--source', SOURCE);
    expect(r.err).toMatch(/feature 3 \(id "h-0"\).*outside longitude -180\.\.180 \/ latitude -90\.\.90/);
    // 3. broken JSON on line 3
    r = await cli(await file('broken.geojson', '{\n  "type": "FeatureCollection",\n  "features": [ { "type": "Feature", } ]\n}'), '--source', SOURCE);
    expect(r.err).toMatch(/not valid JSON \(line 3, column \d+\)/);
    // 4. a self-crossing outline (valid JSON, invalid geometry per PostGIS) after good features: the whole file rolls back
    const bow = structuredClone(town);
    bow.features[6].geometry.coordinates = [[[LON0, LAT0], [LON0 + 0.0001, LAT0 + 0.0001], [LON0 + 0.0001, LAT0], [LON0, LAT0 + 0.0001], [LON0, LAT0]]];
    r = await cli(await file('bow.geojson', JSON.stringify(bow)), '--source', SOURCE);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/feature 7 \(id "h-4"\): the geometry is not valid \(Self-intersection/);
    expect(r.err).toMatch(/nothing was written/);
    // 5. not GeoJSON at all
    r = await cli(await file('other.json', '{"hello": 1}'), '--source', SOURCE);
    expect(r.err).toMatch(/not a GeoJSON FeatureCollection or Feature/);
    // Nothing of any of them landed, not even the good features before the bad one.
    expect(await countPlaces(SOURCE)).toEqual(before);
    expect(await db('places').where({ source: SOURCE }).whereIn('housenumber', ['501', '502', '503']).count({ n: '*' })).toEqual([{ n: '0' }]);
  });
});

/** Our own OSM XML: 8 nodes, two houses (closed ways with addr:*), one street and a fence (skipped). */
function osmXml(extra = '') {
  const n = (id: number, dLon: number, dLat: number) => `  <node id="${id}" lat="${(LAT0 + 0.002 + dLat).toFixed(7)}" lon="${(LON0 + dLon).toFixed(7)}" version="1"/>`;
  return `<?xml version="1.0" encoding="UTF-8"?>
<osm version="0.6" generator="quietfix-test">
${n(1, 0, 0)}
${n(2, 0.0001, 0)}
${n(3, 0.0001, 0.0001)}
${n(4, 0, 0.0001)}
${n(5, 0.0003, 0)}
${n(6, 0.0004, 0)}
${n(7, 0.0004, 0.0001)}
${n(8, 0.0003, 0.0001)}
  <way id="9001"><nd ref="1"/><nd ref="2"/><nd ref="3"/><nd ref="4"/><nd ref="1"/><tag k="building" v="house"/><tag k="addr:housenumber" v="3"/><tag k="addr:street" v="Test Brindle Walk"/><tag k="addr:postcode" v="QT2 2YY"/></way>
  <way id="9002"><nd ref="5"/><nd ref="6"/><nd ref="7"/><nd ref="8"/><nd ref="5"/><tag k="building" v="yes"/><tag k="addr:housenumber" v="5"/><tag k="addr:street" v="Test Brindle Walk"/></way>
  <way id="9003"><nd ref="1"/><nd ref="6"/><tag k="highway" v="residential"/><tag k="name" v="Test Brindle Walk"/></way>
  <way id="9004"><nd ref="4"/><nd ref="8"/><tag k="barrier" v="fence"/></way>
${extra}</osm>
`;
}

describe('places:import with OpenStreetMap XML', () => {
  it('imports buildings with addresses and named streets; a re-import changes nothing', async () => {
    const p = await file('area.osm', osmXml());
    const first = await cli(p);
    expect(first.code, first.err).toBe(0);
    expect(first.out).toMatch(/3 new, 0 updated, 1 skipped/);
    const house = await db('places').where({ source: 'osm', source_id: 'way/9001' }).first();
    expect(house).toMatchObject({ kind: 'building', housenumber: '3', street: 'Test Brindle Walk', postcode: 'QT2 2YY' });
    const street = await db('places').where({ source: 'osm', source_id: 'way/9003' }).first();
    expect(street).toMatchObject({ kind: 'street', name: 'Test Brindle Walk' });
    const again = await cli(p);
    expect(again.out).toMatch(/0 new, 3 updated/);
    expect(await countPlaces('osm')).toEqual({ buildings: 2, streets: 1, numbered: 2 });
  });

  it('the map answer credits OpenStreetMap for its data (ODbL), and only where OSM data is drawn', async () => {
    // The OSM Foundation's copyright page asks for "© OpenStreetMap contributors" on maps made from the data.
    const hunter = await signIn('hunter@example.test');
    const box = (lon: number, lat: number) => `${lon - 0.001},${lat - 0.001},${lon + 0.001},${lat + 0.001}`;
    const osm = await api(`/api/places?bbox=${box(LON0, LAT0 + 0.002)}`, { session: hunter });
    expect(osm.status, osm.text).toBe(200);
    expect(osm.json.features.some((f: { properties: { street: string } }) => f.properties.street === 'Test Brindle Walk')).toBe(true);
    expect(osm.json.attribution).toEqual([expect.stringMatching(/&copy; <a href="https:\/\/www\.openstreetmap\.org\/copyright">OpenStreetMap<\/a> contributors/)]);
    // The GeoJSON town of our own (no OSM ids) a little further south: nothing to credit.
    const own = await api(`/api/places?bbox=${box(LON0 + 0.002, LAT0)}`, { session: hunter });
    expect(own.json.features.some((f: { properties: { street: string } }) => f.properties.street === 'Test Wharrow Lane')).toBe(true);
    expect(own.json.attribution).toEqual([]);
    // A GeoJSON export from OpenStreetMap (e.g. an Overpass answer) keeps its OSM ids under a source of the club's naming: still credited.
    const overpass = JSON.stringify({ type: 'Feature', id: 'way/424242', properties: { highway: 'service', name: 'Test Overpass Lane' }, geometry: { type: 'LineString', coordinates: [[LON0 + 0.05, LAT0], [LON0 + 0.0505, LAT0]] } });
    await inTransaction((trx) => importPlaceFile(trx, 'overpass.geojson', overpass, SOURCE));
    const fromOverpass = await api(`/api/places?bbox=${box(LON0 + 0.05, LAT0)}`, { session: hunter });
    expect(fromOverpass.json.features.map((f: { properties: { name: string } }) => f.properties.name)).toEqual(['Test Overpass Lane']);
    expect(fromOverpass.json.attribution).toHaveLength(1);
  });

  it('names the line of an XML error and of a way with a missing node, importing nothing', async () => {
    const before = await countPlaces('osm');
    let r = await cli(await file('bad.osm', osmXml('  <way id="9005"><nd ref="1"/><nd ref="77"/><tag k="highway" v="path"/></way>\n')));
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/line 15: way 9005 refers to node 77, which is not in the file/);
    r = await cli(await file('syntax.osm', osmXml('  <way id="9006"><nd ref="1"</way>\n')));
    expect(r.err).toMatch(/not valid XML \(line 15, column \d+\)/);
    r = await cli(await file('gpx.osm', '<?xml version="1.0"?>\n<gpx version="1.1"></gpx>\n'));
    expect(r.err).toMatch(/root element is <gpx>, not <osm>/);
    expect(await countPlaces('osm')).toEqual(before);
  });
});
