import { DEG, bearingResidualDeg } from './internal/angles';
import { ellipseFromNormal } from './internal/ellipse-from-normal';
import { worstOutlier } from './internal/find-outliers';
import { pairwiseIntersections } from './internal/pairwise-intersections';
import { lineProblem, prepareLine, type PreparedLine } from './internal/prepare-lines';
import { solveLines, type Solution } from './internal/solve-lines';
import { chiSquareUpper } from './internal/statistics';
import type { Ellipse, Fix, FixOptions, LineOfBearing } from './types';

/** Lines all within this angle of each other (as lines, at the fix) are treated as parallel. */
const MIN_SPREAD_DEG = 1;
/** A 95 % ellipse longer than this many times the longest range means the lines barely cross. */
const MAX_ELLIPSE_TO_RANGE = 2;
/** Probability of the "lines disagree" warning on clean data. */
const DISAGREE_ALPHA = 0.01;
/** Intersections are drawn up to this far along each line, metres. */
const MAX_DRAWN_LENGTH_M = 30_000;

type Failure = Extract<Fix, { ok: false }>;

function invalid(message: string): Failure {
  return { ok: false, reason: 'invalid-input', message };
}

/** Largest angle between any line and the mean line direction at the fix, degrees (lines: mod 180). */
function spreadDeg(solution: Solution): number {
  let s = 0, c = 0;
  for (const r of solution.rows) {
    s += Math.sin(2 * r.aziAtFixDeg * DEG);
    c += Math.cos(2 * r.aziAtFixDeg * DEG);
  }
  const mean = Math.atan2(s, c) / 2;
  let worst = 0;
  for (const r of solution.rows) {
    const d = Math.abs(bearingResidualDeg(r.aziAtFixDeg, mean / DEG, false));
    worst = Math.max(worst, d);
  }
  return worst * 2;
}

function checkGeometry(solution: Solution, count: number): Failure | Ellipse {
  const message = count === 2
    ? 'These two lines are almost parallel: take the next bearing from a spot well to the side.'
    : 'These lines are almost parallel: take the next bearing from a spot well to the side.';
  const oneSigma95 = ellipseFromNormal(solution.normal, 0.95);
  const maxRange = Math.max(...solution.rows.map((r) => r.rangeM));
  if (!oneSigma95 || spreadDeg(solution) < MIN_SPREAD_DEG || oneSigma95.semiMajorM > MAX_ELLIPSE_TO_RANGE * maxRange) {
    return { ok: false, reason: 'near-parallel', message };
  }
  return oneSigma95;
}

/** Solves, then drops the most inconsistent line while the leave-one-out test flags one. */
function solveWithoutOutliers(lines: PreparedLine[], full: Solution): { solution: Solution; removed: PreparedLine[] } {
  let current = full;
  let kept = lines;
  const removed: PreparedLine[] = [];
  const maxRemoved = Math.floor(lines.length / 3);
  while (removed.length < maxRemoved && kept.length >= 4) {
    const worst = worstOutlier(current.rows, current.normal);
    if (worst < 0) break;
    const next = kept.filter((_, i) => i !== worst);
    const solved = solveLines(next, current);
    if (!solved.ok) break;
    removed.push(kept[worst]);
    kept = next;
    current = solved;
  }
  return { solution: current, removed };
}

function warningsFor(solution: Solution, lines: PreparedLine[], outlierCount: number): string[] {
  const warnings: string[] = [];
  for (const r of solution.rows) {
    if (r.line.oneWay && Math.abs(bearingResidualDeg(r.aziFromObserverDeg, r.line.azimuthDeg, true)) > 90) {
      warnings.push(
        `Line ${r.line.name} was marked one-way (sense antenna), but the fix lies behind it. Check the sense reading, or treat this line as two-way.`,
      );
    }
  }
  const dof = lines.length - 2;
  if (dof >= 1 && outlierCount === 0 && solution.cost > chiSquareUpper(DISAGREE_ALPHA, dof)) {
    warnings.push(
      lines.length === 3
        ? 'The three lines disagree more than their stated sigmas allow, and with only three lines the odd one out cannot be singled out: take a fourth bearing.'
        : 'The lines disagree more than their stated sigmas allow: the sigmas may be too optimistic, or there may be reflections; the ellipse may be too small.',
    );
  }
  return warnings;
}

/**
 * Most likely position of the source from lines of bearing, on the WGS84 ellipsoid, with its
 * error ellipse (maximum likelihood / Stansfield least squares).
 *
 * Residuals are azimuth (observer -> fix) minus bearing, in degrees; `sigmas` is |offset| / sigma.
 * A two-way line counts by its perpendicular miss whichever way it was read. One-way lines enter
 * the position the same way; their residual is reported unfolded and a fix behind one is warned
 * about. Lines are named `id ?? String(index)` in outlierIds and warnings (index in the input array).
 *
 * @param lines bearings: observer in WGS84 degrees, azimuth in degrees clockwise from true north
 * @param opts confidence of the ellipse, in (0, 1), default 0.95
 * @returns a fix with ellipse semi-axes in metres, or a refusal with a plain-language message
 */
export function estimateFix(lines: LineOfBearing[], opts?: FixOptions): Fix {
  if (!Array.isArray(lines)) return invalid('The lines must be a list of bearings.');
  const confidence = opts?.confidence ?? 0.95;
  if (typeof confidence !== 'number' || !(confidence > 0 && confidence < 1)) {
    return invalid('The confidence must be a number between 0 and 1, for example 0.95.');
  }
  const prepared: PreparedLine[] = [];
  for (let i = 0; i < lines.length; i++) {
    const problem = lineProblem(lines[i], i);
    if (problem) return invalid(problem);
    prepared.push(prepareLine(lines[i], i));
  }
  if (prepared.length < 2) {
    return { ok: false, reason: 'too-few-lines', message: 'A fix needs at least two bearings from different spots.' };
  }
  const solved = solveLines(prepared);
  if (!solved.ok) return solved;
  const geometry = checkGeometry(solved, prepared.length);
  if ('ok' in geometry) return geometry;
  const ellipse = ellipseFromNormal(solved.normal, confidence) as Ellipse;

  const { solution: clean, removed } = solveWithoutOutliers(prepared, solved);
  const outlierIds = removed.map((l) => l.name);
  const cleanEllipse = removed.length > 0 ? ellipseFromNormal(clean.normal, confidence) : null;

  const maxRange = Math.max(...solved.rows.map((r) => r.rangeM));
  const drawnLength = Math.min(MAX_DRAWN_LENGTH_M, Math.max(3 * maxRange, 100));
  return {
    ok: true,
    lat: solved.lat,
    lon: solved.lon,
    ellipse,
    residuals: solved.rows.map((r) => {
      const offsetDeg = bearingResidualDeg(r.aziFromObserverDeg, r.line.azimuthDeg, r.line.oneWay);
      return { id: r.line.id, offsetDeg, sigmas: Math.abs(offsetDeg) / r.line.sigmaDeg };
    }),
    outlierIds,
    ...(cleanEllipse ? { withoutOutliers: { lat: clean.lat, lon: clean.lon, ellipse: cleanEllipse } } : {}),
    intersections: pairwiseIntersections(prepared, drawnLength, solved.lon),
    warnings: warningsFor(solved, prepared, outlierIds.length),
  };
}
