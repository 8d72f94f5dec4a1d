/**
 * "Prepare for the field" (components/field/tile-list.ts) and the places layer offline
 * (lib/field/places-fallback.ts): which map tiles cover the area, never more than the cap, checked
 * against @mapbox/tilebelt 2.0.3 (the Web Mercator "slippy map" tile scheme, from the registry);
 * which kept places answers serve a box never asked as such, box overlap checked against Turf 7.4
 * (the shared area of the two rectangles, @turf/intersect + @turf/area).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { pointToTile, tileToBBOX } from '@mapbox/tilebelt';
import { area, bboxPolygon, featureCollection, intersect } from '@turf/turf';
import { tilesForBox, tileUrl } from '@/components/field/tile-list';
import { boxesOverlap, joinKeptPlaces, placesBox, type Box, type KeptPlacesAnswer } from '@/lib/field/places-fallback';

// An invented area on open land (the demo's plain), about 1 km a side.
const AREA: Box = { west: 129.7375, south: -31.0557, east: 129.7480, north: -31.0467 };

describe('tilesForBox', () => {
  it('covers the box exactly: the tiles of its corners (tilebelt) and every tile between, zoom by zoom', () => {
    const tiles = tilesForBox(AREA, [15, 16, 17], 10_000);
    for (const z of [15, 16, 17]) {
      const [x0, y0] = pointToTile(AREA.west, AREA.north, z);
      const [x1, y1] = pointToTile(AREA.east, AREA.south, z);
      const expected = [];
      for (let x = x0; x <= x1; x++) for (let y = y0; y <= y1; y++) expected.push({ z, x, y });
      expect(tiles.filter((t) => t.z === z)).toEqual(expected);
      // each tile's own box (tilebelt) meets the area
      for (const t of tiles.filter((t) => t.z === z)) {
        const [w, s, e, n] = tileToBBOX([t.x, t.y, t.z]);
        expect(w <= AREA.east && AREA.west <= e && s <= AREA.north && AREA.south <= n).toBe(true);
      }
    }
  });

  it('never more than the cap, lowest zoom first; a cap of 0 fetches nothing', () => {
    const all = tilesForBox(AREA, [15, 16, 17, 18], 10_000);
    expect(all.length).toBeGreaterThan(50);
    for (const cap of [0, 1, 7, 50]) {
      const some = tilesForBox(AREA, [15, 16, 17, 18], cap);
      expect(some).toEqual(all.slice(0, cap));
    }
    expect(all.map((t) => t.z)).toEqual([...all.map((t) => t.z)].sort((a, b) => a - b));
  });

  it('fills an XYZ template', () => {
    expect(tileUrl('https://tiles.example.test/{s}/{z}/{x}/{y}{r}.png', { z: 17, x: 112283, y: 77312 })).toBe('https://tiles.example.test/a/17/112283/77312.png');
  });
});

describe('places offline: kept answers that overlap the box asked for', () => {
  const box = (w: number, s: number, e: number, n: number): Box => ({ west: w, south: s, east: e, north: n });
  const url = (b: Box) => `/api/places?bbox=${[b.west, b.south, b.east, b.north].join(',')}`;
  const f = (id: string) => ({ type: 'Feature', id, geometry: null, properties: {} });

  it('reads the bbox of a places URL, and nothing else', () => {
    expect(placesBox(url(AREA))).toEqual(AREA);
    expect(placesBox('https://quietfix.example.test/api/places?bbox=129.74,-31.05,129.75,-31.04')).toEqual(box(129.74, -31.05, 129.75, -31.04));
    for (const bad of ['/api/places', '/api/places?bbox=1,2,3', '/api/places?bbox=a,b,c,d', '/api/places?bbox=2,0,1,1', '/api/places?bbox=0,1,1,0']) expect(placesBox(bad)).toBeNull();
  });

  it('overlap agrees with Turf: two boxes overlap exactly when they share some area', () => {
    const coord = fc.double({ min: -0.01, max: 0.01, noNaN: true });
    const rect = fc.tuple(coord, coord, fc.double({ min: 1e-4, max: 0.01, noNaN: true }), fc.double({ min: 1e-4, max: 0.01, noNaN: true })).map(([w, s, dw, dh]) => box(129.74 + w, -31.05 + s, 129.74 + w + dw, -31.05 + s + dh));
    fc.assert(
      fc.property(rect, rect, (a, b) => {
        const shared = intersect(featureCollection([bboxPolygon([a.west, a.south, a.east, a.north]), bboxPolygon([b.west, b.south, b.east, b.north])]));
        const sharedM2 = shared ? area(shared) : 0;
        // a sliver under 1 m² is float noise at these sizes (common practice, no source)
        if (sharedM2 > 1) expect(boxesOverlap(a, b)).toBe(true);
        if (sharedM2 === 0) expect(boxesOverlap(a, b)).toBe(false);
      }),
      { numRuns: 300 },
    );
    // edges that only touch share no ground
    expect(boxesOverlap(box(0, 0, 1, 1), box(1, 0, 2, 1))).toBe(false);
  });

  it('joins every overlapping answer, each feature once, oldest time kept; none overlapping: null', () => {
    const kept: KeptPlacesAnswer[] = [
      { box: AREA, storedAt: '2026-12-02T09:00:00.000Z', body: { features: [f('a'), f('b'), f('c')], truncated: false, cap: 1500 } },
      { box: box(129.7470, -31.0480, 129.7560, -31.0400), storedAt: '2026-12-02T08:00:00.000Z', body: { features: [f('c'), f('d')], truncated: false, cap: 1500 } },
      { box: box(129.80, -31.0, 129.81, -30.99), storedAt: '2026-12-01T08:00:00.000Z', body: { features: [f('far')], truncated: false } },
    ];
    const wanted = box(129.7440, -31.0500, 129.7500, -31.0450); // inside the area, reaching into the second box
    const r = joinKeptPlaces(wanted, kept)!;
    expect(r.used).toBe(2);
    expect(r.body.features.map((x) => x.id)).toEqual(['a', 'b', 'c', 'd']);
    expect(r.storedAt).toBe('2026-12-02T08:00:00.000Z');
    expect(r.body).toMatchObject({ type: 'FeatureCollection', truncated: false, cap: 1500 });
    expect(joinKeptPlaces(box(120, -30, 120.01, -29.99), kept)).toBeNull();
  });

  it('keeps every credit of the answers it joins, once (the OpenStreetMap notice stays with its data offline)', () => {
    const osm = 'Streets and houses © OpenStreetMap contributors (ODbL)';
    const kept: KeptPlacesAnswer[] = [
      { box: AREA, storedAt: null, body: { features: [f('a')], attribution: [osm] } },
      { box: AREA, storedAt: null, body: { features: [f('b')], attribution: [osm] } },
      { box: AREA, storedAt: null, body: { features: [f('c')] } },
    ];
    expect(joinKeptPlaces(AREA, kept)!.body.attribution).toEqual([osm]);
    expect(joinKeptPlaces(AREA, kept.slice(2))!.body.attribution).toEqual([]);
  });

  it('never more than the API cap; truncated carried or set', () => {
    const many = (from: number, n: number) => Array.from({ length: n }, (_, i) => f(`p${from + i}`));
    const kept: KeptPlacesAnswer[] = [
      { box: AREA, storedAt: null, body: { features: many(0, 3), truncated: false, cap: 4 } },
      { box: AREA, storedAt: null, body: { features: many(3, 3), truncated: false, cap: 4 } },
    ];
    const r = joinKeptPlaces(AREA, kept)!;
    expect(r.body.features).toHaveLength(4);
    expect(r.body.truncated).toBe(true);
    expect(r.storedAt).toBeNull();
    expect(joinKeptPlaces(AREA, [{ box: AREA, storedAt: null, body: { features: [], truncated: true } }])!.body.truncated).toBe(true);
  });
});
