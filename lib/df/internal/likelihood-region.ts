/**
 * Likelihood-ratio confidence region of the fix: the points whose cost exceeds the minimum by
 * less than the chi-square quantile with 2 degrees of freedom (times the variance factor when
 * the lines were found to disagree). Unlike the linearised ellipse it follows the real shape of
 * the cost in poor geometry (small crossing angles, few lines, long range), where the ellipse is
 * too small (Lenth 1981, Technometrics 23(2), likelihood regions for bearing fixes).
 *
 * Traced in the local plane along RAYS directions from the fix: march outward until the cost
 * passes the level, then bisect. The region is star-shaped from the fix in every case seen; a
 * ray that never reaches the level (the lines barely cross) stops at maxRadiusM and the region
 * is reported open.
 */
import { costAt, type Plane } from './plane';

const RAYS = 72;
const BISECTIONS = 14;

export type Region = { ring: [number, number][]; open: boolean };

export function likelihoodRegion(p: Plane, use: ArrayLike<number>, x: [number, number], minCost: number, level: number, firstStepM: number, maxRadiusM: number): Region {
  const ring: [number, number][] = [];
  let open = false;
  const target = minCost + level;
  for (let k = 0; k < RAYS; k++) {
    const t = (2 * Math.PI * k) / RAYS;
    const u = [Math.sin(t), Math.cos(t)];
    const at = (r: number) => costAt(p, [x[0] + r * u[0], x[1] + r * u[1]], use);
    let lo = 0, hi = Math.max(firstStepM, 1e-3);
    while (hi < maxRadiusM && at(hi) < target) { lo = hi; hi *= 1.3; }
    let r: number;
    if (hi >= maxRadiusM && at(maxRadiusM) < target) { r = maxRadiusM; open = true; }
    else {
      hi = Math.min(hi, maxRadiusM);
      for (let b = 0; b < BISECTIONS; b++) { const mid = (lo + hi) / 2; if (at(mid) < target) lo = mid; else hi = mid; }
      r = (lo + hi) / 2;
    }
    ring.push([x[0] + r * u[0], x[1] + r * u[1]]);
  }
  return { ring, open };
}
