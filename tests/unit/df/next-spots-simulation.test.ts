import { describe, expect, it } from 'vitest';
import { estimateFix, nearFieldRadiusM, suggestNextSpots } from '@/lib/df';
import { Geodesic } from 'geographiclib-geodesic';
import { booleanPointInPolygon, point, polygon } from '@turf/turf';
import { distanceM, gaussian, insideEllipse, mulberry32, sceneLines } from './support/scene';

// Seeded simulation, GeographicLib truth (Karney 2013); invented scenes on open sea. A new
// bearing's worth is judged by the 95 % ellipse area after it (Stansfield 1947 error ellipse).
const SOURCE = { lat: 52.7, lon: -24.9 }; // open North Atlantic
const azimuth = (a: { lat: number; lon: number }, b: { lat: number; lon: number }) => Geodesic.WGS84.Inverse(a.lat, a.lon, b.lat, b.lon).azi1 as number;
const at = (p: { lat: number; lon: number }, az: number, d: number) => {
  const r = Geodesic.WGS84.Direct(p.lat, p.lon, az, d);
  return { lat: r.lat2 as number, lon: r.lon2 as number };
};

describe('suggestNextSpots: spots a hunter can follow', { timeout: 30_000 }, () => {
  it('following the first suggestion beats a random reachable spot 200-1000 m away in most trials', () => {
    const rand = mulberry32(909);
    const noise = gaussian(rand);
    let wins = 0, trials = 0;
    for (let t = 0; t < 80; t++) {
      const lines = sceneLines(SOURCE, [{ fromSourceAzDeg: 360 * rand(), rangeM: 400 + 800 * rand() }, { fromSourceAzDeg: 360 * rand(), rangeM: 400 + 800 * rand() }], noise);
      if (!estimateFix(lines).ok) continue;
      const from = lines[1];
      const [best] = suggestNextSpots(lines, { count: 1, from, maxWalkM: 1000 });
      if (!best) continue;
      const random = at(from, 360 * rand(), 200 + 800 * rand());
      const area = (spot: { lat: number; lon: number }) => {
        const f = estimateFix([...lines, { id: 'n', lat: spot.lat, lon: spot.lon, azimuthDeg: azimuth(spot, SOURCE) + 3 * noise(), sigmaDeg: 3 }]);
        return f.ok ? f.ellipse.semiMajorM * f.ellipse.semiMinorM : Infinity;
      };
      trials++;
      if (area(best) < area(random)) wins++;
    }
    console.log(`[df] next spot: first suggestion beats a random reachable spot in ${(wins / trials * 100).toFixed(1)} % of ${trials}`);
    expect(wins / trials).toBeGreaterThan(0.7);
  });

  it('keeps its distance: max(1.5 x semi-major, 3 x lambda / 2 pi, 50 m), outside the ellipse, no mirror pairs', () => {
    const rand = mulberry32(910);
    const noise = gaussian(rand);
    let checked = 0, suggested = 0, innermost = 0, inRegion = 0, mirrors = 0, regions = 0;
    for (let t = 0; t < 40; t++) {
      const lines = sceneLines(SOURCE, [{ fromSourceAzDeg: 360 * rand(), rangeM: 300 + 900 * rand() }, { fromSourceAzDeg: 360 * rand(), rangeM: 300 + 900 * rand() }, { fromSourceAzDeg: 360 * rand(), rangeM: 300 + 900 * rand() }], noise);
      const fix = estimateFix(lines);
      if (!fix.ok) continue;
      const frequencyHz = t % 2 ? 137e3 : 7e6; // 137 kHz: lambda / 2 pi = 348 m (c / 2 pi f)
      const spots = suggestNextSpots(lines, { count: 3, frequencyHz });
      if (fix.region) regions++;
      const min = Math.max(1.5 * fix.ellipse.semiMajorM, 3 * nearFieldRadiusM(frequencyHz), 50);
      expect(spots).toHaveLength(3);
      for (const s of spots) {
        suggested++;
        expect(distanceM(s, fix)).toBeGreaterThanOrEqual(min * 0.999);
        expect(insideEllipse(fix, fix.ellipse, s)).toBe(false);
        // nor inside the likelihood region, when the map draws that instead of the ellipse
        if (fix.region && booleanPointInPolygon(point([s.lon, s.lat]), polygon([fix.region]))) inRegion++;
        if (distanceM(s, fix) < min * 1.01) innermost++;
      }
      for (let i = 0; i < spots.length; i++) for (let j = i + 1; j < spots.length; j++) {
        const d = Math.abs(((azimuth(fix, spots[i]) - azimuth(fix, spots[j]) + 540) % 360) - 180);
        if (Math.min(d, 180 - d) < 10) mirrors++;
        expect(Math.min(d, 180 - d)).toBeGreaterThanOrEqual(29); // different lines through the fix, not mirrors
      }
      checked++;
    }
    console.log(`[df] next spots: ${suggested} suggestions in ${checked} sets; inside the ellipse 0, inside the region ${inRegion} (${regions} sets with a region), on the nearest allowed ring ${(innermost / suggested * 100).toFixed(0)} % (the floor max(1.5 a, 3 lambda / 2 pi, 50 m), was a fixed 100 m), mirror pairs ${mirrors} (was 292 of 292)`);
    expect(inRegion).toBe(0);
    expect(checked).toBeGreaterThan(25);
    expect(nearFieldRadiusM(137e3)).toBeCloseTo(348.3, 1);
  });

  it('not always the innermost ring when walking is limited, and walking distances are returned', () => {
    const lines = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 900 }, { fromSourceAzDeg: 70, rangeM: 800 }]);
    const from = lines[1];
    const spots = suggestNextSpots(lines, { count: 2, from, maxWalkM: 400 });
    expect(spots.length).toBeGreaterThan(0);
    // the nearest allowed ring around the fix lies out of reach here: the spots are farther out
    const fix = estimateFix(lines);
    expect(fix.ok).toBe(true);
    if (!fix.ok) return;
    const floor = Math.max(1.5 * fix.ellipse.semiMajorM, 50);
    for (const s of spots) expect(s.distanceFromFixM).toBeGreaterThan(1.5 * floor);
    for (const s of spots) expect(s.walkM).toBeCloseTo(distanceM(s, from), 0);
    for (const s of spots) expect(s.walkM!).toBeLessThanOrEqual(400.5);
  });
});
