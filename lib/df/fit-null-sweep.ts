import { DEG, foldDeg180 } from './internal/angles';
import { normalQuantile, studentTQuantile } from './internal/statistics';
import type { NullSweepFit, SweepSample } from './types';

const DB = 10 / Math.LN10;
/** Deepest null the model may claim, dB (keeps ln B bounded when a reading sits in the null). */
const MAX_MODEL_DEPTH_DB = 80;
/** Smallest reported 1-sigma of the null azimuth, degrees. */
const SIGMA_FLOOR_DEG = 0.5;
/** Above this the sweep does not pin the null down. */
const SIGMA_CEILING_DEG = 30;
/** Depth reported beyond the readings' own span only if the model pins it to this 1-sigma, dB. */
const DEPTH_TRUST_DB = 1;
const GRID_STEP_DEG = 1;
/** Below this rms misfit the readings follow the model closely enough to trust an extrapolated depth, dB. */
const NOISE_FREE_RMS_DB = 0.1;

type Params = [number, number, number]; // theta0 (rad), ln A, ln B

function model(p: Params, theta: number): { y: number; grad: [number, number, number] } {
  const s = Math.sin(theta - p[0]);
  const a = Math.exp(p[1]);
  const b = Math.exp(p[2]);
  const power = a * s * s + b;
  return {
    y: DB * Math.log(power),
    grad: [(-DB * a * Math.sin(2 * (theta - p[0]))) / power, (DB * a * s * s) / power, (DB * b) / power],
  };
}

function sumSquares(p: Params, th: number[], y: number[]): number {
  let sum = 0;
  for (let k = 0; k < th.length; k++) {
    const d = model(p, th[k]).y - y[k];
    sum += d * d;
  }
  return sum;
}

/** For a fixed null direction: A and B by least squares on relative power error (closed form). */
function amplitudesFor(theta0: number, th: number[], y: number[]): Params {
  let s11 = 0, s12 = 0, s22 = 0, t1 = 0, t2 = 0;
  let minP = Infinity;
  for (let k = 0; k < th.length; k++) {
    const p = Math.pow(10, y[k] / 10);
    minP = Math.min(minP, p);
    const x = Math.sin(th[k] - theta0) ** 2;
    const w = 1 / (p * p);
    s11 += w * x * x; s12 += w * x; s22 += w; t1 += w * x * p; t2 += w * p;
  }
  const det = s11 * s22 - s12 * s12;
  let a = det > 0 ? (s22 * t1 - s12 * t2) / det : 0;
  let b = det > 0 ? (s11 * t2 - s12 * t1) / det : minP;
  const floor = minP * 1e-3;
  if (!(b > floor)) {
    b = floor;
    a = s11 > 0 ? (t1 - s12 * b) / s11 : 0;
  }
  if (!(a > floor)) a = floor;
  return [theta0, Math.log(a), Math.log(b)];
}

function solve3(m: number[][], v: number[]): number[] | null {
  const a = m.map((row, i) => [...row, v[i]]);
  for (let c = 0; c < 3; c++) {
    let piv = c;
    for (let r = c + 1; r < 3; r++) if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) piv = r;
    if (!(Math.abs(a[piv][c]) > 1e-300)) return null;
    [a[c], a[piv]] = [a[piv], a[c]];
    for (let r = 0; r < 3; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let k = c; k < 4; k++) a[r][k] -= f * a[c][k];
    }
  }
  return [a[0][3] / a[0][0], a[1][3] / a[1][1], a[2][3] / a[2][2]];
}

function normalEquations(p: Params, th: number[], y: number[]): { jtj: number[][]; jtr: number[] } {
  const jtj = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  const jtr = [0, 0, 0];
  for (let k = 0; k < th.length; k++) {
    const m = model(p, th[k]);
    const r = y[k] - m.y;
    for (let i = 0; i < 3; i++) {
      jtr[i] += m.grad[i] * r;
      for (let j = 0; j < 3; j++) jtj[i][j] += m.grad[i] * m.grad[j];
    }
  }
  return { jtj, jtr };
}

function clampDepth(p: Params): Params {
  const minLnB = p[1] - MAX_MODEL_DEPTH_DB / DB;
  return [p[0], p[1], Math.max(p[2], minLnB)];
}

/** Levenberg-Marquardt on (theta0, ln A, ln B) from a start point. */
function refine(start: Params, th: number[], y: number[]): Params {
  let p = start;
  let cost = sumSquares(p, th, y);
  let lambda = 1e-3;
  for (let it = 0; it < 200; it++) {
    const { jtj, jtr } = normalEquations(p, th, y);
    const damped = jtj.map((row, i) => row.map((v, j) => (i === j ? v * (1 + lambda) + 1e-12 : v)));
    const step = solve3(damped, jtr);
    if (!step) break;
    const trial = clampDepth([p[0] + step[0], p[1] + step[1], p[2] + step[2]]);
    const trialCost = sumSquares(trial, th, y);
    if (trialCost <= cost) {
      const small = Math.abs(step[0]) < 1e-9 && Math.abs(step[1]) < 1e-9 && Math.abs(step[2]) < 1e-9;
      p = trial; cost = trialCost; lambda = Math.max(lambda / 10, 1e-12);
      if (small) break;
    } else {
      lambda *= 10;
      if (lambda > 1e12) break;
    }
  }
  return p;
}

/** Inverse of a 3x3 matrix (columns solved one by one); null when singular. */
function invert3(m: number[][]): number[][] | null {
  const cols = [0, 1, 2].map((i) => solve3(m, [0, 1, 2].map((j) => (i === j ? 1 : 0))));
  if (cols.some((c) => c === null)) return null;
  return [0, 1, 2].map((r) => [0, 1, 2].map((c) => (cols[c] as number[])[r]));
}

/**
 * Fits a rotation sweep of a small loop: received power P(theta) = A sin^2(theta - theta0) + B
 * (figure-eight pattern; B fills the null: imperfect balance, noise), by least squares on the
 * levels in dB, where reading errors live. Grid search of theta0, then Levenberg-Marquardt on
 * (theta0, ln A, ln B).
 *
 * @param samples loop AXIS azimuth (degrees clockwise from true north; any range) and level (dBm)
 * @returns nullAzimuthDeg: the bearing line's azimuth, degrees in [0, 180);
 *   sigmaDeg: 1-sigma from the parameter covariance scaled by the residual variance and the
 *   small-sample factor t(0.975, n - 3) / z(0.975), floor 0.5;
 *   nullDepthDb: model maximum over minimum, limited to the readings' span (+1 dB) unless the
 *   readings follow the model closely and pin the depth to 1 dB; rmsResidualDb: rms misfit in dB. ok:false when the sweep cannot
 *   give a null.
 */
export function fitNullSweep(samples: SweepSample[]): NullSweepFit {
  if (!Array.isArray(samples) || samples.length < 4) {
    return { ok: false, reason: 'too-few-samples', message: 'A sweep needs at least four readings at different loop angles.' };
  }
  const th: number[] = [];
  const y: number[] = [];
  for (const s of samples) {
    if (!s || !Number.isFinite(s.azimuthDeg) || !Number.isFinite(s.levelDbm)) {
      return { ok: false, reason: 'invalid-input', message: 'Every reading needs a finite loop angle and level.' };
    }
    th.push(s.azimuthDeg * DEG);
    y.push(s.levelDbm);
  }
  const distinct = new Set(samples.map((s) => foldDeg180(s.azimuthDeg).toFixed(2)));
  if (distinct.size < 3) {
    return { ok: false, reason: 'unconstrained', message: 'The readings cover fewer than three loop angles: the null cannot be located.' };
  }
  const maxY = Math.max(...y);
  const minY = Math.min(...y);
  if (maxY - minY < 1) {
    return { ok: false, reason: 'no-null', message: 'All readings are about equal: no null was found. Turn the loop through a wider arc.' };
  }
  let best: Params = amplitudesFor(0, th, y);
  let bestCost = Infinity;
  for (let g = 0; g < 180; g += GRID_STEP_DEG) {
    const p = clampDepth(amplitudesFor(g * DEG, th, y));
    const c = sumSquares(p, th, y);
    if (c < bestCost) { bestCost = c; best = p; }
  }
  const p = refine(best, th, y);
  const rss = sumSquares(p, th, y);
  const dof = th.length - 3;
  const variance = dof > 0 ? rss / dof : 0;
  const inv = invert3(normalEquations(p, th, y).jtj);
  if (!inv) {
    return { ok: false, reason: 'unconstrained', message: 'These readings do not pin the null down: add readings on both sides of it.' };
  }
  // small samples: the residual variance is itself uncertain, so the sigma is scaled by
  // t(0.975, dof) / z(0.975) (Student 1908), and a 95 % interval of +-1.96 sigma stays honest
  const smallSample = dof > 0 ? studentTQuantile(0.975, dof) / normalQuantile(0.975) : 1;
  const sigmaDeg = (smallSample * Math.sqrt(Math.max(variance * inv[0][0], 0))) / DEG;
  if (!(sigmaDeg <= SIGMA_CEILING_DEG)) {
    return { ok: false, reason: 'unconstrained', message: 'These readings do not pin the null down: add readings on both sides of it.' };
  }
  const modelDepth = DB * Math.log1p(Math.exp(p[1] - p[2]));
  const depthSigma = DB * Math.sqrt(Math.max(variance * (inv[1][1] + inv[2][2] - 2 * inv[1][2]), 0));
  const span = maxY - minY + DEPTH_TRUST_DB;
  const rmsResidualDb = Math.sqrt(rss / th.length);
  const supported = depthSigma <= DEPTH_TRUST_DB && rmsResidualDb < NOISE_FREE_RMS_DB;
  const nullDepthDb = supported ? modelDepth : Math.min(modelDepth, span);
  return {
    ok: true,
    nullAzimuthDeg: foldDeg180(p[0] / DEG),
    sigmaDeg: Math.max(sigmaDeg, SIGMA_FLOOR_DEG),
    nullDepthDb,
    rmsResidualDb,
  };
}
