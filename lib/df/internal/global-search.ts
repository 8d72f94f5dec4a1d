/**
 * Global search for the lowest cost: the plane's cost (plane.ts) can have more than one minimum
 * in poor geometry (next to an observer, along a long thin valley), so the solver starts from the
 * linear least-squares point and from up to MAX_STARTS pairwise crossings, the best crossing
 * angles first, and keeps the lowest cost.
 */
import { chiSquareUpper } from './statistics';
import { costAt, planeCrossings, planeLinearStart, planeSolve, subPlane, truncatedCostAt, type Plane } from './plane';

/** Pairwise crossings tried as starts, best crossing angle first. */
const MAX_STARTS = 50;
/** Up to this many lines every start is iterated; above, only the few best-scoring starts. */
const ITERATE_ALL_MAX_LINES = 60;
const ITERATED_STARTS_LARGE = 3;
/** Lines used to score starts in large sets. */
const SCORE_LINES = 200;

/** Candidate start points in plane metres (linear start first). */
function startCandidates(p: Plane, use?: ArrayLike<number>): [number, number][] {
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

/**
 * The lowest plane cost over `use` from every candidate start; null when nothing solves. Above
 * ITERATE_ALL_MAX_LINES lines the starts are scored and iterated on SCORE_LINES lines spread over
 * the set (the ellipsoid solve then refines on all of them), so the search cost stays bounded.
 */
export function planeOptimum(p: Plane, use?: ArrayLike<number>): { x: [number, number]; cost: number } | null {
  const m = use ? use.length : p.w.length;
  let q = p;
  let qUse = use;
  if (m > ITERATE_ALL_MAX_LINES) {
    q = subPlane(p, spread(use ?? Array.from({ length: m }, (_, i) => i), SCORE_LINES));
    qUse = undefined;
    // many lines that agree: the linear start is already in the right valley
    const linear = planeLinearStart(q);
    const quick = linear && planeSolve(q, linear);
    if (quick && quick.cost <= chiSquareUpper(0.01, q.w.length - 2)) return quick;
  }
  let starts = startCandidates(p, use);
  if (m > ITERATE_ALL_MAX_LINES) {
    const scored = starts.map((x) => ({ x, c: costAt(q, x) })).sort((a, b) => a.c - b.c);
    starts = scored.slice(0, ITERATED_STARTS_LARGE).map((s) => s.x);
  }
  let best: { x: [number, number]; cost: number } | null = null;
  for (const s of starts) {
    const r = planeSolve(q, s, qUse);
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
  const sub = subPlane(p, spread(Array.from({ length: p.w.length }, (_, i) => i), SCORE_LINES));
  let best = starts[0], bestCost = Infinity;
  for (const s of starts) {
    const c = truncatedCostAt(sub, s, cap);
    if (c < bestCost) { bestCost = c; best = s; }
  }
  return best;
}

/** At most this many of the lines, spread evenly over the input order. */
function spread(idx: ArrayLike<number>, most: number): number[] {
  const out: number[] = [];
  const step = Math.max(1, idx.length / most);
  for (let t = 0; t < idx.length && out.length < most; t += step) out.push(idx[Math.floor(t)]);
  return out;
}
