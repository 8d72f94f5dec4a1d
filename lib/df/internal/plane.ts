/**
 * A local east/north plane around an origin: the cheap model used to search for the fix (starts
 * from pairwise crossings, subsets of lines, the likelihood region). The answer is always refined
 * on the ellipsoid afterwards (solve-lines.ts, GeographicLib geodesics, Karney 2013).
 *
 * Observers are projected with the ellipsoid's radii of curvature at the origin; a bearing's
 * direction in the plane is corrected for the convergence of meridians (delta lon * sin lat), so
 * over a few kilometres the plane's azimuths agree with the geodesic ones to a few hundredths of
 * a degree, well inside any bearing's sigma.
 */
import { DEG, bearingResidualDeg, wrapDeg180 as wrapLon } from './angles';
import { approxEastNorth, offsetEastNorth } from './geodesy';
import type { PreparedLine } from './prepare-lines';
import { invertSym2, type Sym2 } from './sym2';

export type Plane = {
  originLat: number;
  originLon: number;
  /** Observer east, north (metres), bearing direction in the plane (radians), weight, one-way. */
  e: Float64Array;
  n: Float64Array;
  theta: Float64Array;
  w: Float64Array;
  oneWay: Uint8Array;
};

export function toPlane(lines: PreparedLine[], originLat: number, originLon: number): Plane {
  const k = lines.length;
  const p: Plane = { originLat, originLon, e: new Float64Array(k), n: new Float64Array(k), theta: new Float64Array(k), w: new Float64Array(k), oneWay: new Uint8Array(k) };
  const sinLat = Math.sin(originLat * DEG);
  for (let i = 0; i < k; i++) {
    const l = lines[i];
    const [e, n] = approxEastNorth(originLat, originLon, l.lat, l.lon);
    p.e[i] = e;
    p.n[i] = n;
    // meridians converge toward the pole: a northward line east of the origin leans west in the plane
    p.theta[i] = (l.azimuthDeg - wrapLon(l.lon - originLon) * sinLat) * DEG;
    p.w[i] = l.weight;
    p.oneWay[i] = l.oneWay ? 1 : 0;
  }
  return p;
}

/** The plane of the lines `use` only (same origin and frame). */
export function subPlane(p: Plane, use: ArrayLike<number>): Plane {
  const pick = (a: Float64Array) => Float64Array.from(Array.from(use, (i) => a[i]));
  return { ...p, e: pick(p.e), n: pick(p.n), theta: pick(p.theta), w: pick(p.w), oneWay: Uint8Array.from(Array.from(use, (i) => p.oneWay[i])) };
}

/** Back from plane metres to latitude/longitude. */
export function fromPlane(p: Plane, x: [number, number]): { lat: number; lon: number } {
  return offsetEastNorth(p.originLat, p.originLon, x[0], x[1]);
}

/** Residual of line i at x in radians (folded for two-way lines). */
function residualAt(p: Plane, i: number, x: [number, number]): number {
  const az = Math.atan2(x[0] - p.e[i], x[1] - p.n[i]) / DEG;
  return bearingResidualDeg(az, p.theta[i] / DEG, p.oneWay[i] === 1) * DEG;
}

/** Chi-square cost at x over the lines in `use` (all when omitted). */
export function costAt(p: Plane, x: [number, number], use?: ArrayLike<number>): number {
  let s = 0;
  const m = use ? use.length : p.w.length;
  for (let k = 0; k < m; k++) {
    const i = use ? use[k] : k;
    const r = residualAt(p, i, x);
    s += p.w[i] * r * r;
  }
  return s;
}

/** Truncated-quadratic cost: each line adds at most cap (in chi-square units). */
export function truncatedCostAt(p: Plane, x: [number, number], cap: number): number {
  let s = 0;
  for (let i = 0; i < p.w.length; i++) {
    const r = residualAt(p, i, x);
    s += Math.min(p.w[i] * r * r, cap);
  }
  return s;
}

/** Normal matrix J'WJ (1/m^2) at x over `use`. */
export function normalAt(p: Plane, x: [number, number], use?: ArrayLike<number>): Sym2 {
  let a = 0, b = 0, c = 0;
  const m = use ? use.length : p.w.length;
  for (let k = 0; k < m; k++) {
    const i = use ? use[k] : k;
    const dE = x[0] - p.e[i], dN = x[1] - p.n[i];
    const rho2 = Math.max(dE * dE + dN * dN, 1e-4);
    const jE = dN / rho2, jN = -dE / rho2;
    a += p.w[i] * jE * jE; b += p.w[i] * jE * jN; c += p.w[i] * jN * jN;
  }
  return [a, b, c];
}

/**
 * Gauss-Newton with step halving on the plane's cost over `use`, from x0. Returns the point and
 * its cost, or null when the normal matrix is singular there.
 */
export function planeSolve(p: Plane, x0: [number, number], use?: ArrayLike<number>, maxIterations = 30): { x: [number, number]; cost: number } | null {
  let x: [number, number] = [x0[0], x0[1]];
  let cost = costAt(p, x, use);
  const m = use ? use.length : p.w.length;
  for (let it = 0; it < maxIterations; it++) {
    let a = 0, b = 0, c = 0, gE = 0, gN = 0;
    for (let k = 0; k < m; k++) {
      const i = use ? use[k] : k;
      const dE = x[0] - p.e[i], dN = x[1] - p.n[i];
      const rho2 = Math.max(dE * dE + dN * dN, 1e-4);
      const jE = dN / rho2, jN = -dE / rho2;
      const r = residualAt(p, i, x);
      const w = p.w[i];
      a += w * jE * jE; b += w * jE * jN; c += w * jN * jN; gE += w * jE * r; gN += w * jN * r;
    }
    const ridge = 1e-10 * (a + c);
    const inv = invertSym2([a + ridge, b, c + ridge]);
    if (!inv) return it === 0 ? null : { x, cost };
    let sE = -(inv[0] * gE + inv[1] * gN), sN = -(inv[1] * gE + inv[2] * gN);
    if (!Number.isFinite(sE + sN)) return { x, cost };
    let accepted = false;
    for (let half = 0; half < 12; half++) {
      const t: [number, number] = [x[0] + sE, x[1] + sN];
      const tc = costAt(p, t, use);
      if (tc <= cost) {
        x = t;
        const done = Math.hypot(sE, sN) < 1e-3 || cost - tc < 1e-9 * (1 + cost);
        cost = tc;
        accepted = true;
        if (done) return { x, cost };
        break;
      }
      sE /= 2; sN /= 2;
    }
    if (!accepted) return { x, cost };
  }
  return { x, cost };
}

/**
 * Weighted linear least squares on perpendicular distances, reweighted once by 1/range^2
 * (bearing error grows with range): a start that needs no iteration. Null if singular.
 */
export function planeLinearStart(p: Plane, use?: ArrayLike<number>): [number, number] | null {
  let x: [number, number] | null = null;
  let floorM = 1;
  const m = use ? use.length : p.w.length;
  for (let pass = 0; pass < 2; pass++) {
    let a = 0, b = 0, c = 0, u = 0, v = 0;
    for (let k = 0; k < m; k++) {
      const i = use ? use[k] : k;
      const nE = Math.cos(p.theta[i]), nN = -Math.sin(p.theta[i]);
      let w = p.w[i];
      if (x) {
        const d = Math.max(Math.hypot(x[0] - p.e[i], x[1] - p.n[i]), floorM);
        w /= d * d;
      }
      const q = nE * p.e[i] + nN * p.n[i];
      a += w * nE * nE; b += w * nE * nN; c += w * nN * nN; u += w * nE * q; v += w * nN * q;
    }
    const inv = invertSym2([a, b, c]);
    if (!inv) return x;
    const y: [number, number] = [inv[0] * u + inv[1] * v, inv[1] * u + inv[2] * v];
    x = y;
    // floor of the 1/range^2 weights: a tenth of the median range (a crossing near one observer
    // must not hand that line all the weight)
    const ranges: number[] = [];
    for (let k = 0; k < m; k++) { const i = use ? use[k] : k; ranges.push(Math.hypot(y[0] - p.e[i], y[1] - p.n[i])); }
    ranges.sort((q, r) => q - r);
    floorM = Math.max(1, 0.1 * ranges[ranges.length >> 1]);
  }
  return x;
}

/** Lines taking part in the crossing search, at most this many (spread over the input). */
const CROSSING_LINES = 40;

/**
 * Crossing points of pairs of lines, best crossing angle first, at most `cap`. Large sets use
 * CROSSING_LINES lines spread evenly over the input, so the cost stays bounded.
 */
export function planeCrossings(p: Plane, cap: number): [number, number][] {
  const total = p.w.length;
  const step = Math.max(1, total / CROSSING_LINES);
  const idx: number[] = [];
  for (let t = 0; t < total && idx.length < CROSSING_LINES; t += step) idx.push(Math.floor(t));
  const pairs: { i: number; j: number; s: number }[] = [];
  for (let a = 0; a < idx.length; a++) {
    for (let b = a + 1; b < idx.length; b++) {
      const s = Math.abs(Math.sin(p.theta[idx[a]] - p.theta[idx[b]]));
      if (s > Math.sin(2 * DEG)) pairs.push({ i: idx[a], j: idx[b], s });
    }
  }
  pairs.sort((u, v) => v.s - u.s || u.i - v.i || u.j - v.j);
  const out: [number, number][] = [];
  for (const { i, j } of pairs.slice(0, cap)) {
    const ui = [Math.sin(p.theta[i]), Math.cos(p.theta[i])], uj = [Math.sin(p.theta[j]), Math.cos(p.theta[j])];
    const den = ui[0] * uj[1] - ui[1] * uj[0];
    const t = ((p.e[j] - p.e[i]) * uj[1] - (p.n[j] - p.n[i]) * uj[0]) / den;
    const x: [number, number] = [p.e[i] + t * ui[0], p.n[i] + t * ui[1]];
    if (Number.isFinite(x[0]) && Number.isFinite(x[1]) && Math.hypot(x[0], x[1]) < 1e6) out.push(x);
  }
  return out;
}
