/**
 * Timing of the bearing math (run: npx tsx scripts/bench-df.ts). Invented scene at sea
 * (North Atlantic, open water), seeded noise, so figures are comparable between runs.
 */
import { estimateFix, suggestNextSpots, type LineOfBearing } from '../lib/df';
import geographiclib from 'geographiclib-geodesic';

// The scenes are built and scored with GeographicLib itself (Karney 2013), not lib/df's internals.
const { Geodesic } = geographiclib;

/** Park-Miller minimal standard generator, uniform in (0, 1): seeded, so runs compare. */
function parkMiller(seed: number): () => number {
  let state = seed % 2147483647 || 1;
  return () => (state = (state * 16807) % 2147483647) / 2147483647;
}

const SOURCE = { lat: 47.5, lon: -30.25 };

/** Lines toward SOURCE with 3-degree noise; blunderShare of them bent by 20-90 degrees (reflections). */
function scene(count: number, seed: number, blunderShare = 0): LineOfBearing[] {
  const rand = parkMiller(seed);
  const normal = () => Math.sqrt(-2 * Math.log(rand())) * Math.cos(2 * Math.PI * rand());
  return Array.from({ length: count }, (_, i) => {
    const obs = Geodesic.WGS84.Direct(SOURCE.lat, SOURCE.lon, rand() * 360, 200 + rand() * 4800);
    const inv = Geodesic.WGS84.Inverse(obs.lat2 as number, obs.lon2 as number, SOURCE.lat, SOURCE.lon);
    const bend = rand() < blunderShare ? (rand() < 0.5 ? -1 : 1) * (20 + 70 * rand()) : 0;
    return { id: `b${i}`, lat: obs.lat2 as number, lon: obs.lon2 as number, azimuthDeg: (inv.azi1 as number) + 3 * normal() + bend, sigmaDeg: 3 };
  });
}

function medianMs(runs: number, fn: () => void): number {
  for (let i = 0; i < 15; i++) fn(); // warm-up: let the JIT settle, measure the steady state
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[times.length >> 1];
}

/** The plain approach for comparison: every pairwise crossing in a local plane, averaged. */
function pairwiseMean(lines: LineOfBearing[]): { lat: number; lon: number } {
  const o = lines[0];
  const pts = lines.map((l) => {
    const r = Geodesic.WGS84.Inverse(o.lat, o.lon, l.lat, l.lon);
    const a = ((r.azi1 as number) * Math.PI) / 180;
    return [(r.s12 as number) * Math.sin(a), (r.s12 as number) * Math.cos(a), Math.sin((l.azimuthDeg * Math.PI) / 180), Math.cos((l.azimuthDeg * Math.PI) / 180)];
  });
  let sx = 0, sy = 0, n = 0;
  for (let i = 0; i < pts.length; i++) {
    for (let j = i + 1; j < pts.length; j++) {
      const [x1, y1, dx1, dy1] = pts[i];
      const [x2, y2, dx2, dy2] = pts[j];
      const den = dx1 * dy2 - dy1 * dx2;
      if (Math.abs(den) < 1e-9) continue;
      const t = ((x2 - x1) * dy2 - (y2 - y1) * dx2) / den;
      sx += x1 + t * dx1; sy += y1 + t * dy1; n++;
    }
  }
  const e = sx / n, nn = sy / n;
  const p = Geodesic.WGS84.Direct(o.lat, o.lon, (Math.atan2(e, nn) * 180) / Math.PI, Math.hypot(e, nn));
  return { lat: p.lat2 as number, lon: p.lon2 as number };
}

const lines1000 = scene(1000, 7);
const fix = estimateFix(lines1000);
const fixMs = medianMs(41, () => estimateFix(lines1000));
const lines12 = scene(12, 11);
const spotsMs = medianMs(51, () => suggestNextSpots(lines12));
const pairMs = medianMs(5, () => pairwiseMean(lines1000));
const pair = pairwiseMean(lines1000);
const miss = (p: { lat: number; lon: number }) => Geodesic.WGS84.Inverse(SOURCE.lat, SOURCE.lon, p.lat, p.lon).s12 as number;

console.log('Quietfix bearing math, median of repeated runs');
console.log(`estimateFix, 1,000 lines (incl. outlier test, 190 intersections): ${fixMs.toFixed(2)} ms  (target < 10 ms)`);
console.log(`suggestNextSpots, 384 candidates x 5 sigma points (12 lines):   ${spotsMs.toFixed(2)} ms  (target < 100 ms)`);
console.log(`plain pairwise intersections, all 499,500 pairs averaged:       ${pairMs.toFixed(2)} ms`);
if (fix.ok) console.log(`miss from the true point: estimateFix ${miss(fix).toFixed(1)} m (95 % semi-major ${fix.ellipse.semiMajorM.toFixed(1)} m), pairwise mean ${miss(pair).toFixed(1)} m`);

// Speed with blunders: clean vs 5 % reflections in the same run (ratio is the figure to watch)
console.log('');
console.log('clean vs 5 % blunders (20-90 degrees), same run; ratio = blunders / clean');
const rows: { n: number; clean: number; blunder: number }[] = [];
for (const n of [100, 1000, 4000]) {
  const clean = scene(n, 21);
  const dirty = scene(n, 21, 0.05);
  const runs = n >= 4000 ? 9 : 21;
  const cleanMs = medianMs(runs, () => estimateFix(clean));
  const blunderMs = medianMs(runs, () => estimateFix(dirty));
  rows.push({ n, clean: cleanMs, blunder: blunderMs });
  const f = estimateFix(dirty);
  const named = f.ok ? f.outlierIds.length : 0;
  console.log(`  ${String(n).padStart(5)} lines: clean ${cleanMs.toFixed(2).padStart(8)} ms, 5 % blunders ${blunderMs.toFixed(2).padStart(8)} ms, ratio ${(blunderMs / cleanMs).toFixed(2)} (target <= 5 at 1,000); ${named} set aside, miss ${f.ok ? miss(f).toFixed(1) : '-'} m`);
}
const growth = rows[2].blunder / rows[1].blunder;
console.log(`  growth 1,000 -> 4,000 lines with blunders: x${growth.toFixed(2)} (linear would be x4)`);
const huge = scene(10_000, 23, 0.05);
const hugeMs = medianMs(3, () => estimateFix(huge));
console.log(`  10,000 lines with 5 % blunders: ${hugeMs.toFixed(0)} ms (the leave-one-out re-solve loop it replaces took about 24 s)`);

// Small sets: exhaustive leave-k-out subsets
const twelve = scene(12, 5, 0);
twelve[3].azimuthDeg += 35; twelve[8].azimuthDeg -= 50;
const twelveCleanMs = medianMs(51, () => estimateFix(scene(12, 5, 0)));
const twelveMs = medianMs(51, () => estimateFix(twelve));
console.log(`  12 lines: clean ${twelveCleanMs.toFixed(2)} ms, two reflections ${twelveMs.toFixed(2)} ms (exhaustive leave-k-out subsets, k <= 4)`);
