import { describe, expect, it } from 'vitest';
import { Geodesic } from 'geographiclib-geodesic';
import { estimateFix, type LineOfBearing } from '@/lib/df';
import { prepareLine } from '@/lib/df/internal/prepare-lines';
import { chiSquareUpper } from '@/lib/df/internal/statistics';
import { solveLines } from '@/lib/df/internal/solve-lines';
import { covers } from './support/covers';
import { distanceM, gaussian, mulberry32, sceneLines, type Spot } from './support/scene';

// Seeded Monte Carlo against GeographicLib geodesic truth (Karney 2013). Reference treatments:
// Stansfield 1947 (Gaussian bearing errors, chi-square consistency, variance factor),
// Lenth 1981, Technometrics 23(2) (robust and likelihood-region treatment of bearing fixes).
// A reflected null is simulated as a bearing bent by a fixed angle (common practice, no source).
const SOURCE = { lat: 41.3, lon: -33.8 }; // open North Atlantic (invented scene)
const TRIALS = 200;

function ring(n: number, rand: () => number): Spot[] {
  return Array.from({ length: n }, (_, i) => ({ fromSourceAzDeg: (360 / n) * i + 20 * rand(), rangeM: 400 + 1200 * rand(), sigmaDeg: 3 }));
}

type Tally = { covered: number; named: number; wrongKept: number; silentMiss: number; fixes: number };

function reflectionTrials(n: number, bendDeg: number, seed: number, trials = TRIALS): Tally {
  const rand = mulberry32(seed);
  const noise = gaussian(rand);
  const t: Tally = { covered: 0, named: 0, wrongKept: 0, silentMiss: 0, fixes: 0 };
  for (let k = 0; k < trials; k++) {
    const lines = sceneLines(SOURCE, ring(n, rand), noise);
    const bad = k % n;
    lines[bad].azimuthDeg += rand() < 0.5 ? bendDeg : -bendDeg;
    const fix = estimateFix(lines);
    if (!fix.ok) continue;
    t.fixes++;
    const hit = covers(fix, SOURCE);
    if (hit) t.covered++;
    if (fix.outlierIds.length === 1 && fix.outlierIds[0] === `L${bad}`) t.named++;
    if (fix.outlierIds.length > 0 && !fix.outlierIds.includes(`L${bad}`)) t.wrongKept++;
    if (!hit && fix.outlierIds.length === 0 && fix.notices.length === 0) t.silentMiss++;
  }
  return t;
}

describe('a reflected bearing is set aside from the main fix (Lenth 1981; Stansfield 1947)', { timeout: 30_000 }, () => {
  it('5 lines, one bent by 30 degrees: the main 95 % region covers the source (was 2.8 %)', () => {
    const t = reflectionTrials(5, 30, 501);
    console.log(`[df] 5 lines, 30 deg reflection: covered ${(t.covered / t.fixes * 100).toFixed(1)} %, named ${(t.named / t.fixes * 100).toFixed(1)} %`);
    expect(t.covered / t.fixes).toBeGreaterThanOrEqual(0.9);
    expect(t.named / t.fixes).toBeGreaterThanOrEqual(0.88);
  });

  it('4 lines, one 15-degree blunder: fewer silent misses (was 30 %; a 5-sigma blunder among 4 lines is often undetectable)', () => {
    const t = reflectionTrials(4, 15, 401);
    console.log(`[df] 4 lines, 15 deg blunder: silent miss ${(t.silentMiss / t.fixes * 100).toFixed(1)} %, covered ${(t.covered / t.fixes * 100).toFixed(1)} %`);
    expect(t.silentMiss / t.fixes).toBeLessThan(0.25);
  });

  it('4 lines, one bent by 30 degrees: a good line is rarely set aside instead of the bad one (was 16-19 %)', () => {
    const t = reflectionTrials(4, 30, 402);
    console.log(`[df] 4 lines, 30 deg reflection: wrong line set aside ${(t.wrongKept / t.fixes * 100).toFixed(1)} %, named ${(t.named / t.fixes * 100).toFixed(1)} %, covered ${(t.covered / t.fixes * 100).toFixed(1)} %`);
    expect(t.wrongKept / t.fixes).toBeLessThan(0.05);
    expect(t.covered / t.fixes).toBeGreaterThanOrEqual(0.85);
  });

  it('8 lines, one bent by 30 degrees: named and covered', () => {
    const t = reflectionTrials(8, 30, 801, 120);
    console.log(`[df] 8 lines, 30 deg reflection: covered ${(t.covered / t.fixes * 100).toFixed(1)} %, named ${(t.named / t.fixes * 100).toFixed(1)} %`);
    expect(t.covered / t.fixes).toBeGreaterThanOrEqual(0.9);
    expect(t.named / t.fixes).toBeGreaterThanOrEqual(0.9);
  });

  it('8 lines, two bent by 40 degrees: both set aside, main fix covers', () => {
    const rand = mulberry32(802);
    const noise = gaussian(rand);
    let both = 0, covered = 0, fixes = 0;
    for (let k = 0; k < 60; k++) {
      const lines = sceneLines(SOURCE, ring(8, rand), noise);
      lines[1].azimuthDeg += 40;
      lines[5].azimuthDeg -= 40;
      const fix = estimateFix(lines);
      if (!fix.ok) continue;
      fixes++;
      if ([...fix.outlierIds].sort().join() === 'L1,L5') both++;
      if (covers(fix, SOURCE)) covered++;
    }
    console.log(`[df] 8 lines, two 40 deg reflections: both named ${both} of ${fixes}, covered ${covered}`);
    expect(both / fixes).toBeGreaterThanOrEqual(0.9);
    expect(covered / fixes).toBeGreaterThanOrEqual(0.88);
  });

  it('clean data: lines are rarely set aside (false-flag rate under 3 % with 6 and 20 lines)', () => {
    for (const n of [6, 20]) {
      const rand = mulberry32(600 + n);
      const noise = gaussian(rand);
      let flagged = 0;
      for (let k = 0; k < 150; k++) {
        const fix = estimateFix(sceneLines(SOURCE, ring(n, rand), noise));
        if (fix.ok && fix.outlierIds.length > 0) flagged++;
      }
      console.log(`[df] clean ${n} lines: false flags ${(flagged / 1.5).toFixed(1)} %`);
      expect(flagged / 150).toBeLessThan(0.04);
    }
  });
});

describe('a line set aside never switches off the disagreement of the rest (Stansfield 1947 variance factor)', { timeout: 30_000 }, () => {
  it('kept lines whose chi-square passes its 95 % quantile: lines-disagree beside lines-set-aside, ellipse widened', () => {
    // bearing errors twice the stated sigma (sigmas too optimistic) plus one 60-degree reflection
    const rand = mulberry32(31);
    const noise = gaussian(rand);
    let aside = 0, both = 0;
    for (const n of [8, 20]) {
      for (let k = 0; k < 60; k++) {
        const lines = sceneLines(SOURCE, ring(n, rand), () => 2 * noise());
        lines[2].azimuthDeg += 60;
        const fix = estimateFix(lines);
        if (!fix.ok || fix.outlierIds.length === 0) continue;
        aside++;
        const kept = fix.residuals.filter((r) => !r.setAside);
        const chi2 = kept.reduce((c, r) => c + r.sigmas ** 2, 0);
        const dof = kept.length - 2;
        if (chi2 <= chiSquareUpper(0.05, dof)) continue;
        both++;
        expect(fix.notices.map((x) => x.code)).toEqual(expect.arrayContaining(['lines-set-aside', 'lines-disagree']));
        expect(fix.varianceFactor).toBeCloseTo(chi2 / dof, 1);
      }
    }
    console.log(`[df] lines set aside in ${aside} fixes, the rest still disagreeing (and said so) in ${both}`);
    expect(both).toBeGreaterThan(20);
  });
});

describe('lines that cannot tell which is wrong say so and widen the ellipse (Stansfield 1947 variance factor)', { timeout: 30_000 }, () => {
  it('three lines that disagree: a structured notice, ellipse scaled by sqrt(chi-square / dof)', () => {
    const lines = sceneLines(SOURCE, [0, 120, 240].map((az) => ({ fromSourceAzDeg: az, rangeM: 800, sigmaDeg: 2 })));
    lines[0].azimuthDeg += 12;
    const fix = estimateFix(lines);
    expect(fix.ok).toBe(true);
    if (!fix.ok) return;
    expect(fix.notices.map((n) => n.code)).toContain('cannot-tell-which');
    expect(fix.varianceFactor).toBeGreaterThan(3.84); // chi-square(1) 95 % quantile
    expect(covers(fix, SOURCE)).toBe(true);
  });

  it('a fix at an observer always says so (fix-at-observer)', () => {
    // two lines aimed straight at the spot where line A was taken, A itself toward the source:
    // every line passes through A's spot, so the cost is least there (invented scene)
    const [a] = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 900 }]);
    const aimedAt = (id: string, az: number, range: number) => {
      const o = Geodesic.WGS84.Direct(a.lat, a.lon, az, range);
      const back = Geodesic.WGS84.Inverse(o.lat2 as number, o.lon2 as number, a.lat, a.lon);
      return { id, lat: o.lat2 as number, lon: o.lon2 as number, azimuthDeg: (back.azi1 as number) + 0.3, sigmaDeg: 3 };
    };
    for (const lines of [[a, aimedAt('B', 90, 500), aimedAt('C', 200, 700)], [a, aimedAt('B', 90, 500), aimedAt('C', 200, 700), aimedAt('D', 320, 600)]]) {
      const fix = estimateFix(lines);
      expect(fix.ok).toBe(true);
      if (!fix.ok) continue;
      expect(distanceM(a, fix)).toBeLessThan(10);
      const notice = fix.notices.find((n) => n.code === 'fix-at-observer');
      expect(notice?.ids).toEqual(['L0']);
    }
  });
});

describe('global search: the lowest cost, not the nearest valley (brute force on GeographicLib geodesics, Karney 2013)', { timeout: 30_000 }, () => {
  // Invented three-line scenes with large bearing errors (degrees, per line) in which Gauss-Newton
  // from the linear least-squares start alone stops in a local minimum of higher cost (found by
  // a seeded search, checked below with the solver's own internals).
  const scenes: { spots: [number, number][]; noiseDeg: number[] }[] = [
    { spots: [[172.3, 636], [141.6, 2106], [153.8, 744]], noiseDeg: [-4.83, -5.79, 16.48] },
    { spots: [[132.1, 1937], [143.2, 772], [116.8, 1969]], noiseDeg: [17.9, -10.91, 12.39] },
    { spots: [[265, 536], [77.1, 1133], [285.5, 2117]], noiseDeg: [13.24, 7.11, -10.01] },
    { spots: [[134.9, 205], [294.6, 1406], [309.8, 1456]], noiseDeg: [-3.21, 7.44, 14.25] },
  ];
  const fold = (d: number) => { const x = ((d % 180) + 180) % 180; return x > 90 ? x - 180 : x; };
  const cost = (lines: LineOfBearing[], p: { lat: number; lon: number }) =>
    lines.reduce((c, l) => c + (fold((Geodesic.WGS84.Inverse(l.lat, l.lon, p.lat, p.lon).azi1 as number) - l.azimuthDeg) / (l.sigmaDeg as number)) ** 2, 0);

  it.each(scenes.map((s, i) => [i, s] as const))('scene %i: no point within 10 km has a lower cost than the fix', (_, s) => {
    const lines = sceneLines(SOURCE, s.spots.map(([fromSourceAzDeg, rangeM]) => ({ fromSourceAzDeg, rangeM, sigmaDeg: 3 }))).map((l, i) => ({ ...l, azimuthDeg: l.azimuthDeg + s.noiseDeg[i] }));
    const fix = estimateFix(lines);
    expect(fix.ok).toBe(true);
    if (!fix.ok) return;
    const atFix = cost(lines, fix);
    const linearOnly = solveLines(lines.map(prepareLine));
    expect(linearOnly.ok && linearOnly.cost).toBeGreaterThan(atFix + 1); // the scene does have a worse valley
    let best = Infinity;
    for (let e = -10_000; e <= 10_000; e += 100) {
      for (let n = -10_000; n <= 10_000; n += 100) {
        const p = Geodesic.WGS84.Direct(fix.lat, fix.lon, (Math.atan2(e, n) * 180) / Math.PI, Math.hypot(e, n));
        best = Math.min(best, cost(lines, { lat: p.lat2 as number, lon: p.lon2 as number }));
      }
    }
    expect(atFix).toBeLessThanOrEqual(best + 1e-3);
    // lines that disagree this much are never shown without a notice
    expect(fix.notices.length).toBeGreaterThan(0);
  });
});
