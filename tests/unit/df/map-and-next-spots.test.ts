import { describe, expect, it } from 'vitest';
import { ellipsePolygon, estimateFix, geodesicLine, suggestNextSpots } from '@/lib/df';
import { Geodesic } from 'geographiclib-geodesic';
import { distanceM, sceneLines } from './support/scene';

const azimuthFrom = (a: { lat: number; lon: number }, b: { lat: number; lon: number }) =>
  Geodesic.WGS84.Inverse(a.lat, a.lon, b.lat, b.lon).azi1 as number;

// Distances checked with GeographicLib (Karney 2013). Invented places on open sea.
const SOURCE = { lat: 36.1, lon: -41.7 }; // mid North Atlantic

describe('geodesicLine and ellipsePolygon', () => {
  it('draws the line both ways (or one way) along the geodesic', () => {
    const line = { lat: 36.1, lon: 179.99, azimuthDeg: 90 };
    const pts = geodesicLine(line, 2000, 4);
    expect(pts).toHaveLength(9);
    expect(distanceM({ lat: pts[0][0], lon: pts[0][1] }, line)).toBeCloseTo(2000, 3);
    expect(distanceM({ lat: pts[8][0], lon: pts[8][1] }, line)).toBeCloseTo(2000, 3);
    expect(pts[8][1]).toBeGreaterThan(180); // continuous across the 180 meridian
    expect(geodesicLine({ ...line, oneWay: true }, 2000, 4)).toHaveLength(5);
    expect(geodesicLine({ ...line, lat: NaN }, 2000, 4)).toEqual([]);
  });
  it('ellipse ring: closed, vertices at the semi-axes', () => {
    const e = { semiMajorM: 300, semiMinorM: 100, majorAxisAzimuthDeg: 30, confidence: 0.95 };
    const ring = ellipsePolygon(SOURCE, e, 4);
    expect(ring).toHaveLength(5);
    expect(ring[4]).toEqual(ring[0]);
    expect(distanceM({ lat: ring[0][0], lon: ring[0][1] }, SOURCE)).toBeCloseTo(300, 3);
    expect(distanceM({ lat: ring[1][0], lon: ring[1][1] }, SOURCE)).toBeCloseTo(100, 3);
  });
});

describe('suggestNextSpots', () => {
  it('suggests spread-out spots that shrink the ellipse', () => {
    const lines = sceneLines(SOURCE, [{ fromSourceAzDeg: 180, rangeM: 900 }, { fromSourceAzDeg: 220, rangeM: 800 }]);
    const fix = estimateFix(lines);
    expect(fix.ok).toBe(true);
    if (!fix.ok) return;
    const spots = suggestNextSpots(lines);
    expect(spots).toHaveLength(3);
    for (const s of spots) expect(s.expectedSemiMajorM).toBeLessThan(fix.ellipse.semiMajorM);
    expect(spots[0].expectedSemiMajorM).toBeLessThanOrEqual(spots[2].expectedSemiMajorM);
    // best spot is off to the side of the two nearly-southern lines (common practice: cross at right angles)
    const az = (p: { lat: number; lon: number }) => Math.atan2(p.lon - fix.lon, p.lat - fix.lat) * (180 / Math.PI);
    const side = Math.abs(((az(spots[0]) % 180) + 180) % 180 - 90);
    expect(side).toBeLessThan(45);
    // spread: no two suggestions within 30 degrees as seen from the fix
    for (let i = 0; i < spots.length; i++) for (let j = i + 1; j < spots.length; j++) {
      const d = Math.abs(((az(spots[i]) - az(spots[j]) + 540) % 360) - 180);
      expect(d).toBeGreaterThanOrEqual(29);
    }
    // taking that bearing gives about the predicted ellipse (scored by the information-matrix update)
    const taken = { id: 'next', lat: spots[0].lat, lon: spots[0].lon, azimuthDeg: azimuthFrom(spots[0], fix), sigmaDeg: 3 };
    const after = estimateFix([...lines, taken]);
    expect(after.ok && after.ellipse.semiMajorM / spots[0].expectedSemiMajorM).toBeGreaterThan(0.9);
    expect(after.ok && after.ellipse.semiMajorM / spots[0].expectedSemiMajorM).toBeLessThan(1.1);
  });

  it('with one line: spots at right angles to it', () => {
    const line = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 700 }])[0]; // observer north, bearing south
    const spots = suggestNextSpots([line]);
    expect(spots.length).toBeGreaterThan(0);
    for (const s of spots) expect(Number.isFinite(s.expectedSemiMajorM)).toBe(true);
    // the best spot lies east or west of the line, not along it
    const dLon = Math.abs(spots[0].lon - line.lon) * Math.cos((line.lat * Math.PI) / 180);
    expect(dLon).toBeGreaterThan(Math.abs(spots[0].lat - SOURCE.lat) * 0.5);
  });

  it('no lines or invalid lines give no spots', () => {
    expect(suggestNextSpots([])).toEqual([]);
    expect(suggestNextSpots([{ lat: NaN, lon: 0, azimuthDeg: 0 }])).toEqual([]);
    expect(suggestNextSpots(null as never)).toEqual([]);
  });
});
