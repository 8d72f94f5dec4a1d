import { DEG } from './internal/angles';
import { geodesicDirect } from './internal/geodesy';
import { lineProblem, prepareLine, type PreparedLine } from './internal/prepare-lines';
import { solveLines } from './internal/solve-lines';
import { chiSquare2Scale } from './internal/statistics';
import { eigenSym2, invertSym2, type Sym2 } from './internal/sym2';
import type { LineOfBearing, NextSpot, NextSpotOptions } from './types';

const RADII = 10;
const AZIMUTHS = 50;
/** With a single line the source is assumed this far along it (clamped to the ring radii), metres. */
const ASSUMED_RANGE_M = 700;
const K95 = chiSquare2Scale(0.95);

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Current best point and its information matrix (east/north, 1/m^2). */
function currentState(lines: PreparedLine[], minRangeM: number, maxRangeM: number): { lat: number; lon: number; normal: Sym2 } {
  if (lines.length >= 2) {
    const solved = solveLines(lines);
    if (solved.ok) return solved;
  }
  // One line (or no usable crossing): assume the source some way along the sharpest line.
  const line = lines.reduce((a, b) => (b.sigmaDeg < a.sigmaDeg ? b : a));
  const range = Math.min(Math.max(ASSUMED_RANGE_M, minRangeM), maxRangeM);
  const p = geodesicDirect(line.lat, line.lon, line.azimuthDeg, range);
  const jE = Math.cos(p.azi2 * DEG) / range;
  const jN = -Math.sin(p.azi2 * DEG) / range;
  return { lat: p.lat, lon: p.lon, normal: [line.weight * jE * jE, line.weight * jE * jN, line.weight * jN * jN] };
}

/** 95 % semi-major in metres after adding a line of weight w from azimuth alpha (radians) at range r. */
function semiMajorWith(normal: Sym2, w: number, alpha: number, r: number): number {
  const jE = Math.cos(alpha) / r;
  const jN = -Math.sin(alpha) / r;
  const cov = invertSym2([normal[0] + w * jE * jE, normal[1] + w * jE * jN, normal[2] + w * jN * jN]);
  return cov ? K95 * Math.sqrt(Math.max(eigenSym2(cov).major, 0)) : Infinity;
}

/**
 * Where to take the next bearing to shrink the error ellipse most. Candidates lie on rings around
 * the current fix (10 radii from minRangeM to maxRangeM x 50 azimuths); each is scored by the 95 %
 * ellipse semi-major expected after one more two-way line from there pointing at the fix, with the
 * median sigma of the lines so far (information-matrix update, no re-solve). The best are returned,
 * best first, at least 30 degrees apart as seen from the fix. With one line only, the source is
 * assumed 700 m along it (clamped to the radii), so the spots come out roughly at right angles.
 * @param lines bearings so far
 * @param opts minRangeM / maxRangeM ring radii in metres (default 100 / 2000), count (default 3)
 * @returns spots in WGS84 degrees with expectedSemiMajorM in metres; [] for no or invalid lines
 */
export function suggestNextSpots(lines: LineOfBearing[], opts?: NextSpotOptions): NextSpot[] {
  if (!Array.isArray(lines) || lines.length === 0) return [];
  const minRangeM = opts?.minRangeM ?? 100;
  const maxRangeM = opts?.maxRangeM ?? 2000;
  const count = Math.round(opts?.count ?? 3);
  if (!(minRangeM > 0 && maxRangeM >= minRangeM && Number.isFinite(maxRangeM) && count >= 1)) return [];
  if (lines.some((l, i) => lineProblem(l, i) !== null)) return [];
  const prepared = lines.map(prepareLine);
  const state = currentState(prepared, minRangeM, maxRangeM);
  const sigmaRad = median(prepared.map((l) => l.sigmaDeg)) * DEG;
  const w = 1 / (sigmaRad * sigmaRad);

  const candidates: { alpha: number; r: number; score: number }[] = [];
  for (let i = 0; i < RADII; i++) {
    const r = minRangeM * Math.pow(maxRangeM / minRangeM, RADII > 1 ? i / (RADII - 1) : 0);
    for (let k = 0; k < AZIMUTHS; k++) {
      const alpha = (2 * Math.PI * k) / AZIMUTHS;
      candidates.push({ alpha, r, score: semiMajorWith(state.normal, w, alpha, r) });
    }
  }
  candidates.sort((a, b) => a.score - b.score);

  const separation = Math.min(30, 180 / count) * DEG;
  const chosen: typeof candidates = [];
  for (const c of candidates) {
    if (chosen.length >= Math.min(count, 50)) break;
    const apart = chosen.every((o) => Math.abs(Math.atan2(Math.sin(c.alpha - o.alpha), Math.cos(c.alpha - o.alpha))) >= separation - 1e-9);
    if (apart && Number.isFinite(c.score)) chosen.push(c);
  }
  return chosen.map((c) => {
    const p = geodesicDirect(state.lat, state.lon, c.alpha / DEG, c.r);
    return { lat: p.lat, lon: p.lon, expectedSemiMajorM: c.score };
  });
}
