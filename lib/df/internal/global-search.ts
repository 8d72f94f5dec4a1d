/**
 * Global search for the lowest cost: the plane's cost (plane.ts) can have more than one minimum
 * in poor geometry (next to an observer, along a long thin valley), so the solver starts from the
 * linear least-squares point and from up to MAX_STARTS pairwise crossings, the best crossing
 * angles first, and keeps the lowest cost.
 */
import { costAt, planeCrossings, planeLinearStart, planeSolve, subPlane, truncatedCostAt, type Plane } from './plane';

/** Pairwise crossings tried as starts, best crossing angle first. */
export const MAX_STARTS = 50;
/** Up to this many lines every start is iterated; above, only the few best-scoring starts. */
const ITERATE_ALL_MAX_LINES = 60;
const ITERATED_STARTS_LARGE = 3;

/** Candidate start points in plane metres (linear start first). */
export function startCandidates(p: Plane, use?: ArrayLike<number>): [number, number][] {
  const out: [number, number][] = [];
  const linear = planeLinearStart(p, use);
  if (linear) out.push(linear);
  if (!use) out.push(...planeCrossings(p, MAX_STARTS));
  else {
    // crossings among the used lines only
    out.push(...planeCrossings(subPlane(p, use), MAX_STARTS));
  }
  return out;
}

/** The lowest plane cost over `use` from every candidate start; null when nothing solves. */
export function planeOptimum(p: Plane, use?: ArrayLike<number>): { x: [number, number]; cost: number } | null {
  const m = use ? use.length : p.w.length;
  let starts = startCandidates(p, use);
  if (m > ITERATE_ALL_MAX_LINES) {
    const scored = starts.map((x) => ({ x, c: costAt(p, x, use) })).sort((a, b) => a.c - b.c);
    starts = scored.slice(0, ITERATED_STARTS_LARGE).map((s) => s.x);
  }
  let best: { x: [number, number]; cost: number } | null = null;
  for (const s of starts) {
    const r = planeSolve(p, s, use);
    if (r && Number.isFinite(r.cost) && (!best || r.cost < best.cost - 1e-9 * (1 + best.cost))) best = r;
  }
  return best;
}

/**
 * Start for the robust solve: the candidate with the lowest truncated-quadratic cost (each line
 * adds at most `cap` chi-square units: a redescending loss, Hampel et al. 1986), scored on at
 * most SCORE_LINES lines spread over the input so a thousand lines stay cheap.
 */
export function robustStart(p: Plane, cap: number): [number, number] | null {
  const starts = startCandidates(p);
  if (starts.length === 0) return null;
  const m = p.w.length;
  const step = Math.max(1, m / SCORE_LINES);
  const idx: number[] = [];
  for (let t = 0; t < m && idx.length < SCORE_LINES; t += step) idx.push(Math.floor(t));
  const sub = subPlane(p, idx);
  let best = starts[0], bestCost = Infinity;
  for (const s of starts) {
    const c = truncatedCostAt(sub, s, cap);
    if (c < bestCost) { bestCost = c; best = s; }
  }
  return best;
}

const SCORE_LINES = 200;
