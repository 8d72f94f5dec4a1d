/**
 * Which lines to set aside before the fix the product acts on.
 *
 * Up to EXHAUSTIVE_MAX_LINES lines: every subset that leaves out k lines, k = 0, 1, ... up to a
 * third of the lines (at least three kept), is solved in the local plane and scored by its
 * chi-square statistic; the smallest k at which some subset is consistent (chi-square below its
 * 1 - alpha quantile, n - k - 2 degrees of freedom) wins, the lowest chi-square at that k first.
 * When another consistent subset at the same k puts the source elsewhere (outside the first
 * one's 95 % ellipse), the lines cannot tell which is wrong: nothing is set aside and the caller
 * says so. This is the exhaustive subset search of least-squares outlier diagnostics (a minimum
 * number of deletions that makes the fit pass the chi-square test; see Lenth 1981 for the
 * likelihood treatment of bearing fixes and Hampel et al. 1986 for the robustness frame).
 *
 * Above that: iterative rejection by the rank-one downdate of the normal matrix. At the current
 * optimum a kept line i would lower the cost by w r^2 / (1 - h) if removed, a set-aside line
 * would raise it by w r^2 / (1 + h) if added back (h its leverage); every line whose figure passes
 * the Bonferroni-corrected chi-square(1) quantile is set aside, the rest re-solved from the
 * previous optimum, until the set stops changing. The first set comes from a robust start (the
 * lowest truncated-quadratic cost over the pairwise crossings).
 */
import { chiSquare2Scale, chiSquareUpper } from './statistics';
import { fromPlane, normalAt, planeLinearStart, planeSolve, type Plane } from './plane';
import type { PreparedLine } from './prepare-lines';
import { rowsAt, solveLines, type LineRow, type Solution } from './solve-lines';
import { eigenSym2, invertSym2 } from './sym2';
import { robustStart } from './global-search';
import { approxEastNorth } from './geodesy';

export const EXHAUSTIVE_MAX_LINES = 12;
/** Probability that clean lines fail the consistency test. */
export const CONSISTENCY_ALPHA = 0.01;

/** Share of lines flagged at the all-lines optimum up to which the rejection starts from there. */
const FEW_FLAGGED = 0.01;
/** Chi-square margin within which another consistent subset is a credible rival. */
const RIVAL_MARGIN = 4;

export type RobustChoice = {
  /** Indices (into the lines given) kept and set aside. */
  kept: number[];
  removed: number[];
  /** Several different subsets are consistent and disagree about the place: nothing is set aside. */
  ambiguous: boolean;
  /** Lines that some consistent subset leaves out (when ambiguous), for the warning. */
  suspects: number[];
  /** Plane position of the kept lines' optimum, when known. */
  x?: [number, number];
  /** When ambiguous: plane positions of the consistent subsets that disagree. */
  candidates?: [number, number][];
};

/** Most lines that may be set aside. */
function maxRemovable(n: number): number {
  return Math.max(0, Math.min(Math.floor(n / 3), n - 3));
}

function* combinations(n: number, k: number): Generator<number[]> {
  const c = Array.from({ length: k }, (_, i) => i);
  if (k === 0) { yield []; return; }
  while (true) {
    yield c.slice();
    let i = k - 1;
    while (i >= 0 && c[i] === n - k + i) i--;
    if (i < 0) return;
    c[i]++;
    for (let j = i + 1; j < k; j++) c[j] = c[j - 1] + 1;
  }
}

type Fit = { removed: number[]; use: number[]; x: [number, number]; cost: number };

/** Solve one subset in the plane; null when its lines do not cross usably. */
function fitSubset(p: Plane, use: number[], removed: number[]): Fit | null {
  const start = planeLinearStart(p, use);
  if (!start) return null;
  const r = planeSolve(p, start, use, 20);
  if (!r) return null;
  // the subset must still cross: a 95 % ellipse no longer than twice the longest range
  const cov = invertSym2(normalAt(p, r.x, use));
  if (!cov) return null;
  let maxRange = 0;
  for (const i of use) maxRange = Math.max(maxRange, Math.hypot(r.x[0] - p.e[i], r.x[1] - p.n[i]));
  if (chiSquare2Scale(0.95) * Math.sqrt(eigenSym2(cov).major) > 2 * maxRange) return null;
  return { removed, use, x: r.x, cost: r.cost };
}

/** Exhaustive leave-k-out search in the plane (n up to EXHAUSTIVE_MAX_LINES). */
export function chooseBySubsets(p: Plane, alpha = CONSISTENCY_ALPHA): RobustChoice {
  const n = p.w.length;
  const all = Array.from({ length: n }, (_, i) => i);
  const kMax = maxRemovable(n);
  for (let k = 1; k <= kMax; k++) {
    const threshold = chiSquareUpper(alpha, n - k - 2);
    const passing: Fit[] = [];
    for (const removed of combinations(n, k)) {
      const use = all.filter((i) => !removed.includes(i));
      const f = fitSubset(p, use, removed);
      if (f && f.cost <= threshold) passing.push(f);
    }
    if (passing.length === 0) continue;
    passing.sort((a, b) => a.cost - b.cost);
    const best = passing[0];
    const normal = normalAt(p, best.x, best.use);
    const limit = chiSquareUpper(0.05, 2);
    const rivals = passing.slice(1).filter((f) => {
      // a rival must be nearly as likely (likelihood ratio above exp(-RIVAL_MARGIN / 2)) and
      // put the source elsewhere (outside the best subset's 95 % ellipse)
      if (f.cost - best.cost > RIVAL_MARGIN) return false;
      const dE = f.x[0] - best.x[0], dN = f.x[1] - best.x[1];
      return normal[0] * dE * dE + 2 * normal[1] * dE * dN + normal[2] * dN * dN > limit;
    });
    if (rivals.length > 0) {
      const suspects = [...new Set([best, ...rivals].flatMap((f) => f.removed))].sort((a, b) => a - b);
      return { kept: all, removed: [], ambiguous: true, suspects, candidates: [best, ...rivals].map((f) => f.x) };
    }
    return { kept: best.use, removed: best.removed, ambiguous: false, suspects: [], x: best.x };
  }
  // no subset passes: the lines disagree in a way no small deletion explains
  return { kept: all, removed: [], ambiguous: true, suspects: [] };
}

/** Rank-one leave-one-out / add-one figures of every line at a point (chi-square units). */
function influence(lines: PreparedLine[], keptMask: Uint8Array, lat: number, lon: number): Float64Array | null {
  return influenceOf(rowsAt(lines, lat, lon).rows, keptMask);
}

/** The same from rows already linearised at the point. */
function influenceOf(rows: LineRow[], keptMask: Uint8Array): Float64Array | null {
  let a = 0, b = 0, c = 0;
  for (let i = 0; i < rows.length; i++) {
    if (!keptMask[i]) continue;
    const { jE, jN, line } = rows[i];
    a += line.weight * jE * jE; b += line.weight * jE * jN; c += line.weight * jN * jN;
  }
  const anyKept = keptMask.some((v) => v === 1);
  const inv = anyKept ? invertSym2([a, b, c]) : [0, 0, 0];
  if (!inv) return null;
  const out = new Float64Array(rows.length);
  for (let i = 0; i < rows.length; i++) {
    const { jE, jN, residualRad, line } = rows[i];
    const h = line.weight * (jE * (inv[0] * jE + inv[1] * jN) + jN * (inv[1] * jE + inv[2] * jN));
    const wr2 = line.weight * residualRad * residualRad;
    out[i] = keptMask[i] ? (1 - h > 1e-6 ? wr2 / (1 - h) : 0) : wr2 / (1 + h);
  }
  return out;
}

/** Iterative rejection by rank-one downdate (more than EXHAUSTIVE_MAX_LINES lines). */
export function chooseByRejection(lines: PreparedLine[], p: Plane, full: Solution): { choice: RobustChoice; solution: Solution } {
  const n = lines.length;
  const threshold = chiSquareUpper(CONSISTENCY_ALPHA / n, 1);
  const cap = maxRemovable(n);
  // start: when only a few lines stand out at the all-lines optimum, from there (no extra
  // geodesics); otherwise from the robust crossing, with the lines within the threshold there
  let keptMask: Uint8Array = new Uint8Array(n).fill(1);
  let current: Solution = full;
  let from = { lat: full.lat, lon: full.lon };
  const atFull = influenceOf(full.rows, new Uint8Array(n).fill(1));
  const flagged = atFull ? atFull.filter((v) => v > threshold).length : n;
  if (atFull && flagged <= Math.max(2, FEW_FLAGGED * n)) {
    keptMask = limitRemoval(atFull, threshold, cap);
  } else {
    const start = robustStart(p, threshold);
    if (start) {
      const st = fromPlane(p, start);
      const figures = influence(lines, new Uint8Array(n).fill(0), st.lat, st.lon);
      if (figures) keptMask = limitRemoval(figures, threshold, cap);
      from = st;
    }
  }
  for (let round = 0; round < 8; round++) {
    const kept = lines.filter((_, i) => keptMask[i]);
    const solved = solveLines(kept, from);
    if (!solved.ok) break;
    current = solved;
    from = { lat: solved.lat, lon: solved.lon };
    const figures = influence(lines, keptMask, solved.lat, solved.lon);
    if (!figures) break;
    const next = limitRemoval(figures, threshold, cap);
    if (next.every((v, i) => v === keptMask[i])) break;
    keptMask = next;
  }
  const kept: number[] = [], removed: number[] = [];
  for (let i = 0; i < n; i++) (keptMask[i] ? kept : removed).push(i);
  if (current === full && removed.length > 0) return { choice: { kept: Array.from({ length: n }, (_, i) => i), removed: [], ambiguous: true, suspects: removed }, solution: full };
  const [e, nn] = approxEastNorth(p.originLat, p.originLon, current.lat, current.lon);
  return { choice: { kept, removed, ambiguous: false, suspects: [], x: [e, nn] }, solution: current };
}

/** Keep lines at or under the threshold; never set aside more than cap (the worst go first). */
function limitRemoval(figures: Float64Array, threshold: number, cap: number): Uint8Array {
  const mask = new Uint8Array(figures.length).fill(1);
  const over = [...figures.keys()].filter((i) => figures[i] > threshold).sort((a, b) => figures[b] - figures[a]);
  for (const i of over.slice(0, cap)) mask[i] = 0;
  return mask;
}
