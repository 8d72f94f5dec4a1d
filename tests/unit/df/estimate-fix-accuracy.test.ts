import { describe, expect, it } from 'vitest';
import { estimateFix } from '@/lib/df';
import { distanceM, sceneLines, type Spot } from './support/scene';

// Geodesic truth: GeographicLib (Karney 2013, "Algorithms for geodesics", J. Geodesy 87).
// Source points are open sea / open land, invented.
const places = {
  'equator (Gulf of Guinea, sea)': { lat: 0.0, lon: 2.5 },
  '65 N (Norwegian Sea)': { lat: 65.0, lon: 3.0 },
  '65 S (Southern Ocean)': { lat: -65.0, lon: 150.0 },
  'on the 180 meridian (Bering Sea)': { lat: 58.0, lon: 179.9995 },
  'just west of 180 (South Pacific)': { lat: -30.0, lon: -179.9995 },
};

const geometries: Record<string, (r: number) => Spot[]> = {
  'three lines': (r) => [{ fromSourceAzDeg: 20, rangeM: r }, { fromSourceAzDeg: 130, rangeM: 0.7 * r }, { fromSourceAzDeg: 250, rangeM: 0.5 * r }],
  'two lines at 70 degrees': (r) => [{ fromSourceAzDeg: 200, rangeM: r }, { fromSourceAzDeg: 270, rangeM: 0.8 * r }],
};

describe('estimateFix accuracy with noise-free lines (GeographicLib scenes)', () => {
  for (const [place, source] of Object.entries(places)) {
    for (const [shape, spots] of Object.entries(geometries)) {
      for (const range of [50, 500, 5000, 20000]) {
        it(`${place}, ${shape}, ${range} m`, () => {
          const lines = sceneLines(source, spots(range));
          const fix = estimateFix(lines);
          expect(fix.ok).toBe(true);
          if (!fix.ok) return;
          // requirement: within max(1 m, 0.01 % of the longest range) of the true point
          expect(distanceM(fix, source)).toBeLessThanOrEqual(Math.max(1, 1e-4 * range));
          for (const r of fix.residuals) expect(Math.abs(r.offsetDeg)).toBeLessThan(1e-3);
          expect(fix.outlierIds).toEqual([]);
          expect(fix.allLines).toBeUndefined();
        });
      }
    }
  }

  it('observers on both sides of the 180 meridian (lon 179.99x and -179.99x)', () => {
    const source = { lat: 52.0, lon: 180.0 };
    const lines = sceneLines(source, [{ fromSourceAzDeg: 60, rangeM: 400 }, { fromSourceAzDeg: 290, rangeM: 300 }, { fromSourceAzDeg: 180, rangeM: 900 }]);
    expect(lines.some((l) => l.lon > 179.99) && lines.some((l) => l.lon < -179.99)).toBe(true);
    const fix = estimateFix(lines);
    expect(fix.ok && distanceM(fix, source)).toBeLessThan(1);
    // display crossings are found across the meridian too, near the source
    if (fix.ok) {
      expect(fix.intersections.length).toBe(3);
      for (const p of fix.intersections) expect(distanceM(p, source)).toBeLessThan(5);
    }
  });
});
