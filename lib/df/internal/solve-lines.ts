/**
 * Maximum-likelihood intersection of lines of bearing on the WGS84 ellipsoid (Gauss-Newton).
 *
 * At the estimate X each line contributes the residual r = azimuth(observer -> X) - bearing,
 * folded to a line's perpendicular miss, in radians. Moving X by a small east/north step d
 * changes that azimuth by (J . d) with J = (cos azi2, -sin azi2) / m12, where azi2 is the
 * geodesic's forward azimuth at X and m12 its reduced length (Karney 2013), here taken as the
 * distance s12 (they differ by a part in a million at 20 km). The step solves
 * (J'WJ) d = -J'W r with W = 1/sigma^2, and (J'WJ)^-1 is the covariance of the fix.
 * One-way lines keep the unfolded residual, so the cost rises steeply behind them.
 */
import { DEG, bearingResidualDeg } from './angles';
import { geodesicInverse, offsetEastNorth } from './geodesy';
import { fromPlane, planeLinearStart, toPlane } from './plane';
import type { PreparedLine } from './prepare-lines';
import { invertSym2, type Sym2 } from './sym2';

/** One line linearised at the estimate. */
export type LineRow = {
  line: PreparedLine;
  /** d(azimuth)/d(east, north) in radians per metre. */
  jE: number;
  jN: number;
  /** Perpendicular-miss residual (folded) in radians, used for the position. */
  residualRad: number;
  /** Geodesic distance observer -> estimate in metres. */
  rangeM: number;
  /** Forward azimuth of the observer->estimate geodesic at the estimate, degrees. */
  aziAtFixDeg: number;
  /** Azimuth observer -> estimate, degrees. */
  aziFromObserverDeg: number;
};

export type Solution = {
  ok: true;
  lat: number;
  lon: number;
  rows: LineRow[];
  /** Information matrix J'WJ in east/north, 1/m^2. */
  normal: Sym2;
  /** Weighted sum of squared residuals (chi-square). */
  cost: number;
  iterations: number;
};

export type SolveFailure = { ok: false; reason: 'near-parallel' | 'no-convergence'; message: string };

const MAX_ITERATIONS = 100;
const STEP_TOLERANCE_M = 1e-3;
const DECREMENT_TOLERANCE = 1e-6;
/** Beyond this a "fix" is not a local noise source: the lines are effectively parallel. */
const MAX_FIX_RANGE_M = 1_000_000;

/** The sums of one Gauss-Newton step at a point, with the per-line geodesics kept in typed arrays. */
type Linearisation = {
  normal: Sym2;
  gradient: [number, number];
  cost: number;
  /** Shortest observer -> point distance, metres. */
  minRangeM: number;
  s12: Float64Array;
  azi1: Float64Array;
  azi2: Float64Array;
  residual: Float64Array;
};

function linearise(lines: PreparedLine[], lat: number, lon: number): Linearisation {
  const n = lines.length;
  // Typed arrays instead of one object per line: the solver runs this every iteration, and with
  // 1,000 lines the garbage collector otherwise costs more than the geodesics.
  const s12 = new Float64Array(n), azi1 = new Float64Array(n), azi2 = new Float64Array(n), residual = new Float64Array(n);
  let a = 0, b = 0, c = 0, gE = 0, gN = 0, cost = 0, minRangeM = Infinity;
  for (let i = 0; i < n; i++) {
    const line = lines[i];
    const g = geodesicInverse(line.lat, line.lon, lat, lon);
    const m12 = Math.max(g.s12, 0.01);
    const az2 = g.azi2 * DEG;
    const jE = Math.cos(az2) / m12;
    const jN = -Math.sin(az2) / m12;
    // one-way lines keep their unfolded residual: a point behind one costs dearly (it constrains)
    const r = bearingResidualDeg(g.azi1, line.azimuthDeg, line.oneWay) * DEG;
    const w = line.weight;
    a += w * jE * jE;
    b += w * jE * jN;
    c += w * jN * jN;
    gE += w * jE * r;
    gN += w * jN * r;
    cost += w * r * r;
    s12[i] = g.s12; azi1[i] = g.azi1; azi2[i] = g.azi2; residual[i] = r;
    if (g.s12 < minRangeM) minRangeM = g.s12;
  }
  return { normal: [a, b, c], gradient: [gE, gN], cost, minRangeM, s12, azi1, azi2, residual };
}

/** The per-line rows of a linearisation (built once, for the returned solution). */
function rowsOf(lines: PreparedLine[], lin: Linearisation): LineRow[] {
  return lines.map((line, i) => {
    const m12 = Math.max(lin.s12[i], 0.01);
    const az2 = lin.azi2[i] * DEG;
    return {
      line,
      jE: Math.cos(az2) / m12,
      jN: -Math.sin(az2) / m12,
      residualRad: lin.residual[i],
      rangeM: lin.s12[i],
      aziAtFixDeg: lin.azi2[i],
      aziFromObserverDeg: lin.azi1[i],
    };
  });
}

/** Mean of the observers' positions (via unit vectors, so the order of lines and +-180 do not matter). */
export function meanPosition(lines: PreparedLine[]): { lat: number; lon: number } {
  let x = 0, y = 0, z = 0;
  for (const l of lines) {
    const c = Math.cos(l.lat * DEG);
    x += c * Math.cos(l.lon * DEG); y += c * Math.sin(l.lon * DEG); z += Math.sin(l.lat * DEG);
  }
  if (Math.hypot(x, y, z) < 1e-9 * lines.length) return { lat: lines[0].lat, lon: lines[0].lon };
  return { lat: Math.atan2(z, Math.hypot(x, y)) / DEG, lon: Math.atan2(y, x) / DEG };
}

/** Weighted linear least squares in a local plane around the observers: the plain start point. */
function planarStart(lines: PreparedLine[]): { lat: number; lon: number } | null {
  const o = meanPosition(lines);
  const plane = toPlane(lines, o.lat, o.lon);
  const x = planeLinearStart(plane);
  if (!x || !(Math.hypot(x[0], x[1]) < MAX_FIX_RANGE_M)) return null;
  return fromPlane(plane, x);
}

function parallelFailure(count: number): SolveFailure {
  const message = count === 2
    ? 'These two lines are almost parallel: take the next bearing from a spot well to the side.'
    : 'These lines are almost parallel, so they do not cross at a usable point: take the next bearing from a spot well to the side.';
  return { ok: false, reason: 'near-parallel', message };
}

/** Iterations of plain Gauss-Newton before switching to Newton steps. */
const NEWTON_AFTER = 8;

/** Hessian of half the cost (J'W r gradient) by forward differences, or null if not positive definite. */
function numericHessian(lines: PreparedLine[], lat: number, lon: number, g: [number, number], minRangeM: number): Sym2 | null {
  const h = Math.max(1e-4 * minRangeM, 1e-3);
  const pe = offsetEastNorth(lat, lon, h, 0);
  const pn = offsetEastNorth(lat, lon, 0, h);
  const ge = linearise(lines, pe.lat, pe.lon).gradient;
  const gn = linearise(lines, pn.lat, pn.lon).gradient;
  const a = (ge[0] - g[0]) / h;
  const c = (gn[1] - g[1]) / h;
  const b = ((ge[1] - g[1]) / h + (gn[0] - g[0]) / h) / 2;
  return a > 0 && a * c - b * b > 0 ? [a, b, c] : null;
}

/**
 * Solves for the most likely source position by Gauss-Newton on the ellipsoid from `start`
 * (the global search in global-search.ts picks it), or from the planar linear start.
 */
export function solveLines(lines: PreparedLine[], start?: { lat: number; lon: number }, maxIterations = MAX_ITERATIONS): Solution | SolveFailure {
  const first = start ?? planarStart(lines);
  if (!first) return parallelFailure(lines.length);
  return iterate(lines, first, maxIterations);
}

/** The linearised rows of every line at a point (for leave-one-out / add-one tests). */
export function rowsAt(lines: PreparedLine[], lat: number, lon: number): { rows: LineRow[]; normal: Sym2; cost: number } {
  const lin = linearise(lines, lat, lon);
  return { rows: rowsOf(lines, lin), normal: lin.normal, cost: lin.cost };
}

function iterate(lines: PreparedLine[], first: { lat: number; lon: number }, maxIterations: number): Solution | SolveFailure {
  let lat = first.lat, lon = first.lon;
  let lin = linearise(lines, lat, lon);
  let damping = 1;
  for (let it = 1; it <= maxIterations; it++) {
    // A tiny ridge keeps the step defined when the path passes close to an observer; the point
    // where the gradient vanishes, and the covariance taken from the undamped matrix, are unchanged.
    const [na, nb, nc] = lin.normal;
    const ridge = 1e-10 * (na + nc);
    // Gauss-Newton first; if it crawls (large residuals, curved valley), Newton with the full
    // Hessian from finite differences of the gradient, while that Hessian is positive definite.
    const hessian = it > NEWTON_AFTER ? numericHessian(lines, lat, lon, lin.gradient, lin.minRangeM) : null;
    const inv = (hessian && invertSym2(hessian)) || invertSym2([na + ridge, nb, nc + ridge]);
    if (!inv) return parallelFailure(lines.length);
    const fullE = -(inv[0] * lin.gradient[0] + inv[1] * lin.gradient[1]);
    const fullN = -(inv[1] * lin.gradient[0] + inv[2] * lin.gradient[1]);
    const fullM = Math.hypot(fullE, fullN);
    if (!Number.isFinite(fullM)) return { ok: false, reason: 'no-convergence', message: 'The fix computation did not settle; check the bearings.' };
    const dE = fullE * damping;
    const dN = fullN * damping;
    const stepM = fullM * damping;
    const next = offsetEastNorth(lat, lon, dE, dN);
    // Settled when the full Gauss-Newton step is under a millimetre; when the quadratic model
    // promises a cost drop below 1e-6 (chi-square units: the optimum is within 1e-3 sigma, the
    // case of a long flat valley where Gauss-Newton crawls); or when no shorter step lowers the
    // cost any more (numerical floor).
    const decrement = -(fullE * lin.gradient[0] + fullN * lin.gradient[1]);
    if (fullM < STEP_TOLERANCE_M || decrement < DECREMENT_TOLERANCE || stepM < 1e-6) {
      return { ok: true, lat: next.lat, lon: next.lon, rows: rowsOf(lines, lin), normal: lin.normal, cost: lin.cost, iterations: it };
    }
    const nextLin = linearise(lines, next.lat, next.lon);
    if (nextLin.cost > lin.cost * (1 + 1e-9) + 1e-12) {
      damping /= 2; // overshoot: shorten the step and try again from the same point
      continue;
    }
    damping = Math.min(1, damping * 2);
    lat = next.lat; lon = next.lon; lin = nextLin;
    if (lin.minRangeM > MAX_FIX_RANGE_M) return parallelFailure(lines.length);
  }
  return { ok: false, reason: 'no-convergence', message: 'The fix computation did not settle; check the bearings for typing errors.' };
}
