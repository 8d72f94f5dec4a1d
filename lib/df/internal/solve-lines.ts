/**
 * Maximum-likelihood intersection of lines of bearing on the WGS84 ellipsoid (Gauss-Newton).
 *
 * At the estimate X each line contributes the residual r = azimuth(observer -> X) - bearing,
 * folded to a line's perpendicular miss, in radians. Moving X by a small east/north step d
 * changes that azimuth by (J . d) with J = (cos azi2, -sin azi2) / m12, where azi2 is the
 * geodesic's forward azimuth at X and m12 its reduced length (Karney 2013), here taken as the
 * distance s12 (they differ by a part in a million at 20 km). The step solves
 * (J'WJ) d = -J'W r with W = 1/sigma^2, and (J'WJ)^-1 is the covariance of the fix.
 */
import { DEG, bearingResidualDeg } from './angles';
import { approxEastNorth, geodesicInverse, offsetEastNorth } from './geodesy';
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

const MAX_ITERATIONS = 60;
const STEP_TOLERANCE_M = 1e-3;
/** Beyond this a "fix" is not a local noise source: the lines are effectively parallel. */
const MAX_FIX_RANGE_M = 1_000_000;

function linearise(lines: PreparedLine[], lat: number, lon: number): { rows: LineRow[]; normal: Sym2; gradient: [number, number]; cost: number } {
  const rows: LineRow[] = new Array(lines.length);
  let a = 0, b = 0, c = 0, gE = 0, gN = 0, cost = 0;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i];
    const g = geodesicInverse(line.lat, line.lon, lat, lon);
    const m12 = Math.max(g.s12, 0.01);
    const azi2 = g.azi2 * DEG;
    const jE = Math.cos(azi2) / m12;
    const jN = -Math.sin(azi2) / m12;
    const r = bearingResidualDeg(g.azi1, line.azimuthDeg, false) * DEG;
    const w = line.weight;
    a += w * jE * jE;
    b += w * jE * jN;
    c += w * jN * jN;
    gE += w * jE * r;
    gN += w * jN * r;
    cost += w * r * r;
    rows[i] = { line, jE, jN, residualRad: r, rangeM: g.s12, aziAtFixDeg: g.azi2, aziFromObserverDeg: g.azi1 };
  }
  return { rows, normal: [a, b, c], gradient: [gE, gN], cost };
}

/** Weighted linear least squares in a local plane: the start point of the iteration. */
function planarStart(lines: PreparedLine[]): { lat: number; lon: number } | null {
  const o = lines[0];
  const pts = lines.map((l) => approxEastNorth(o.lat, o.lon, l.lat, l.lon));
  let x: [number, number] | null = null;
  let floorM = 1;
  for (let pass = 0; pass < 2; pass++) {
    let a = 0, b = 0, c = 0, u = 0, v = 0;
    for (let i = 0; i < lines.length; i++) {
      const t = lines[i].azimuthDeg * DEG;
      const nE = Math.cos(t), nN = -Math.sin(t);
      const [pE, pN] = pts[i];
      let w = lines[i].weight;
      if (x) {
        // second pass: weight by 1/range^2 (bearing error grows with range)
        const d = Math.max(Math.hypot(x[0] - pE, x[1] - pN), floorM);
        w /= d * d;
      }
      const k = nE * pE + nN * pN;
      a += w * nE * nE; b += w * nE * nN; c += w * nN * nN;
      u += w * nE * k; v += w * nN * k;
    }
    const inv = invertSym2([a, b, c]);
    if (!inv) {
      if (x) break; // keep the first-pass point
      return null;
    }
    x = [inv[0] * u + inv[1] * v, inv[1] * u + inv[2] * v];
    const ranges = pts.map(([pE, pN]) => Math.hypot((x as number[])[0] - pE, (x as number[])[1] - pN)).sort((p, q) => p - q);
    floorM = Math.max(1, 0.1 * ranges[ranges.length >> 1]);
  }
  if (!x || !(Math.hypot(x[0], x[1]) < MAX_FIX_RANGE_M)) return null;
  return offsetEastNorth(o.lat, o.lon, x[0], x[1]);
}

function parallelFailure(count: number): SolveFailure {
  const message = count === 2
    ? 'These two lines are almost parallel: take the next bearing from a spot well to the side.'
    : 'These lines are almost parallel, so they do not cross at a usable point: take the next bearing from a spot well to the side.';
  return { ok: false, reason: 'near-parallel', message };
}

/** Solves for the most likely source position; `start` skips the planar start. */
export function solveLines(lines: PreparedLine[], start?: { lat: number; lon: number }): Solution | SolveFailure {
  const first = start ?? planarStart(lines);
  if (!first) return parallelFailure(lines.length);
  let lat = first.lat, lon = first.lon;
  let lin = linearise(lines, lat, lon);
  let damping = 1;
  for (let it = 1; it <= MAX_ITERATIONS; it++) {
    // A tiny ridge keeps the step defined when the path passes close to an observer; the point
    // where the gradient vanishes, and the covariance taken from the undamped matrix, are unchanged.
    const [na, nb, nc] = lin.normal;
    const ridge = 1e-10 * (na + nc);
    const inv = invertSym2([na + ridge, nb, nc + ridge]);
    if (!inv) return parallelFailure(lines.length);
    const fullE = -(inv[0] * lin.gradient[0] + inv[1] * lin.gradient[1]);
    const fullN = -(inv[1] * lin.gradient[0] + inv[2] * lin.gradient[1]);
    const fullM = Math.hypot(fullE, fullN);
    if (!Number.isFinite(fullM)) return { ok: false, reason: 'no-convergence', message: 'The fix computation did not settle; check the bearings.' };
    const dE = fullE * damping;
    const dN = fullN * damping;
    const stepM = fullM * damping;
    const next = offsetEastNorth(lat, lon, dE, dN);
    // Settled when the full Gauss-Newton step is under a millimetre, or when no shorter step
    // lowers the cost any more (numerical floor).
    if (fullM < STEP_TOLERANCE_M || stepM < 1e-6) {
      return { ok: true, lat: next.lat, lon: next.lon, rows: lin.rows, normal: lin.normal, cost: lin.cost, iterations: it };
    }
    const nextLin = linearise(lines, next.lat, next.lon);
    if (nextLin.cost > lin.cost * (1 + 1e-9) + 1e-12) {
      damping /= 2; // overshoot: shorten the step and try again from the same point
      continue;
    }
    damping = Math.min(1, damping * 2);
    lat = next.lat; lon = next.lon; lin = nextLin;
    if (lin.rows.every((r) => r.rangeM > MAX_FIX_RANGE_M)) return parallelFailure(lines.length);
  }
  return { ok: false, reason: 'no-convergence', message: 'The fix computation did not settle; check the bearings for typing errors.' };
}
