import { DEG, bearingResidualDeg } from './internal/angles';
import { duplicateGroups } from './internal/duplicates';
import { ellipseFromNormal } from './internal/ellipse-from-normal';
import { planeOptimum } from './internal/global-search';
import { likelihoodRegion } from './internal/likelihood-region';
import { pairwiseIntersections } from './internal/pairwise-intersections';
import { fromPlane, planeSolve, toPlane, type Plane } from './internal/plane';
import { approxEastNorth } from './internal/geodesy';
import { lineProblem, prepareLine, type PreparedLine } from './internal/prepare-lines';
import { chooseByRejection, chooseBySubsets, CONSISTENCY_ALPHA, EXHAUSTIVE_MAX_LINES, type RobustChoice } from './internal/robust-lines';
import { meanPosition, rowsAt, solveLines, type Solution } from './internal/solve-lines';
import { chiSquareUpper } from './internal/statistics';
import { invertSym2 } from './internal/sym2';
import type { Ellipse, Fix, FixEstimate, FixNotice, FixOptions, LineOfBearing } from './types';

/** Lines all within this angle of each other (as lines, at the fix) are treated as parallel. */
const MIN_SPREAD_DEG = 1;
/** A 95 % ellipse longer than this many times the longest range means the lines barely cross. */
const MAX_ELLIPSE_TO_RANGE = 2;
/** The ellipse is widened by the variance factor when chi-square passes this quantile (Stansfield 1947). */
const WIDEN_QUANTILE = 0.95;
/** Intersections are drawn up to this far along each line, metres. */
const MAX_DRAWN_LENGTH_M = 30_000;
/** A fix closer than this to an observer is suspicious (local minimum of the cost), metres. */
const AT_OBSERVER_M = 10;
/** The likelihood region is traced for at most this many kept lines (beyond, the ellipse is exact enough). */
const REGION_MAX_LINES = 50;
/** The region is shown instead of the ellipse when some point of it lies this far off the ellipse (relative). */
const REGION_DEVIATION = 0.2;
/** Below this ratio of 95 % semi-major to the shortest range the ellipse is trusted as it is. */
const LINEAR_ENOUGH = 0.08;
/** How far the region is traced, in longest ranges. */
const REGION_MAX_RANGES = 10;

type Failure = Extract<Fix, { ok: false }>;
type OkFix = Extract<Fix, { ok: true }>;

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
  for (const r of solution.rows) worst = Math.max(worst, Math.abs(bearingResidualDeg(r.aziAtFixDeg, mean / DEG, false)));
  return worst * 2;
}

function crossesUsably(solution: Solution): boolean {
  const oneSigma95 = ellipseFromNormal(solution.normal, 0.95);
  const maxRange = Math.max(...solution.rows.map((r) => r.rangeM));
  return !!oneSigma95 && spreadDeg(solution) >= MIN_SPREAD_DEG && oneSigma95.semiMajorM <= MAX_ELLIPSE_TO_RANGE * maxRange;
}

function parallel(count: number): Failure {
  const message = count === 2
    ? 'These two lines are almost parallel: take the next bearing from a spot well to the side.'
    : 'These lines are almost parallel: take the next bearing from a spot well to the side.';
  return { ok: false, reason: 'near-parallel', message };
}

/** All-lines solution: global search in the plane, refined on the ellipsoid. */
function solveAll(lines: PreparedLine[]): Solution | Failure {
  const o = meanPosition(lines);
  const plane = toPlane(lines, o.lat, o.lon);
  const best = planeOptimum(plane);
  const solved = solveLines(lines, best ? fromPlane(plane, best.x) : undefined);
  if (!solved.ok) return solved;
  return solved;
}

/** One-way lines with the solution behind them (more than 90 degrees off their sense). */
function behindAny(solution: Solution) {
  return solution.rows.filter((r) => r.line.oneWay && Math.abs(bearingResidualDeg(r.aziFromObserverDeg, r.line.azimuthDeg, true)) > 90);
}

/**
 * The refusal when the lines, read as two-way, agree on a place behind some one-way line (the
 * fix can only exist behind it); null when that is not the case.
 */
function onlyBehind(lines: PreparedLine[]): Failure | null {
  if (!lines.some((l) => l.oneWay)) return null;
  const twoWay = solveAll(lines.map((l) => ({ ...l, oneWay: false })));
  if (!twoWay.ok || !crossesUsably(twoWay) || twoWay.cost > chiSquareUpper(CONSISTENCY_ALPHA, Math.max(lines.length - 2, 1))) return null;
  const sense = new Map(lines.map((l) => [l.index, l.oneWay]));
  const behind = behindAny({ ...twoWay, rows: twoWay.rows.map((r) => ({ ...r, line: { ...r.line, oneWay: sense.get(r.line.index) === true } })) });
  if (behind.length === 0) return null;
  const names = behind.map((r) => r.line.name).join(', ');
  return {
    ok: false,
    reason: 'behind-one-way',
    message: `The lines cross only behind ${behind.length === 1 ? `line ${names}, which is` : `lines ${names}, which are`} marked one-way (sense antenna): check the sense reading, or treat the line as two-way.`,
  };
}

/** Chi-square with its degrees of freedom and the variance factor applied to the covariance. */
function varianceFactor(cost: number, count: number): number {
  const dof = count - 2;
  if (dof < 1 || !(cost > chiSquareUpper(1 - WIDEN_QUANTILE, dof))) return 1;
  return cost / dof;
}

function scaled(e: Ellipse, k: number): Ellipse {
  return { ...e, semiMajorM: e.semiMajorM * k, semiMinorM: e.semiMinorM * k };
}

/**
 * The likelihood-ratio region around the solution of `lines`, as a [lon, lat] ring, with the
 * factor by which the ellipse must grow to enclose it; null when the ellipse describes it well.
 */
function regionFor(lines: PreparedLine[], solution: Solution, ellipse: Ellipse, factor: number, confidence: number): { ring: [number, number][]; grow: number; open: boolean } | null {
  if (lines.length > REGION_MAX_LINES) return null;
  // the linearisation is good when the ellipse is small against the ranges: skip the tracing
  const minRange = Math.min(...solution.rows.map((r) => r.rangeM));
  if (ellipse.semiMajorM < LINEAR_ENOUGH * minRange) return null;
  const plane = toPlane(lines, solution.lat, solution.lon);
  const opt = planeSolve(plane, [0, 0]) ?? { x: [0, 0] as [number, number], cost: solution.cost };
  const maxRange = Math.max(...solution.rows.map((r) => r.rangeM));
  const level = chiSquareUpper(1 - confidence, 2) * factor;
  const region = likelihoodRegion(plane, Array.from({ length: lines.length }, (_, i) => i), opt.x, opt.cost, level, 0.25 * ellipse.semiMinorM, REGION_MAX_RANGES * maxRange);
  // each vertex in units of the ellipse (1 on its boundary); the region's area (shoelace)
  const az = ellipse.majorAxisAzimuthDeg * DEG;
  let worst = 0, area = 0;
  region.ring.forEach(([e, n], k) => {
    const along = e * Math.sin(az) + n * Math.cos(az);
    const across = e * Math.cos(az) - n * Math.sin(az);
    worst = Math.max(worst, Math.abs(Math.hypot(along / ellipse.semiMajorM, across / ellipse.semiMinorM) - 1));
    const [e2, n2] = region.ring[(k + 1) % region.ring.length];
    area += (e * n2 - e2 * n) / 2;
  });
  if (worst <= REGION_DEVIATION && !region.open) return null;
  // the ellipse grows to the region's area (never shrinks): its size stays an honest summary
  const grow = Math.max(1, Math.sqrt(Math.abs(area) / (Math.PI * ellipse.semiMajorM * ellipse.semiMinorM)));
  const ring = region.ring.map((x) => { const p = fromPlane(plane, x); return [p.lon, p.lat] as [number, number]; });
  ring.push(ring[0]);
  return { ring, grow, open: region.open };
}

/**
 * Most likely position of the source from lines of bearing, on the WGS84 ellipsoid, with its
 * error ellipse, robust to a few wrong lines (a reflected null).
 *
 * Maximum likelihood / Stansfield (1947) least squares, from a global search over pairwise
 * crossings; lines inconsistent with the rest are set aside (exhaustive leave-k-out subsets for
 * up to 12 lines, rank-one downdate rejection above); when the lines cannot tell which is wrong,
 * nothing is set aside, a notice says so and the ellipse is widened by the variance factor. In
 * poor geometry the likelihood-ratio region (Lenth 1981) is returned beside an ellipse that
 * encloses it. One-way lines constrain (their residual is not folded); a fix that can only lie
 * behind one is refused. Duplicate lines count once.
 *
 * Residuals are azimuth (observer -> fix) minus bearing, in degrees; `sigmas` is |offset| / sigma.
 * Lines are named `id ?? String(index)` in outlierIds and notices (index in the input array).
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
  const notices: FixNotice[] = [];

  // duplicates: each group counts once, by its sharpest line (ties: by position, so the input
  // order never matters)
  const o = meanPosition(prepared);
  const groups = duplicateGroups(prepared, toPlane(prepared, o.lat, o.lon));
  const repeated = new Set<number>();
  for (const g of groups) {
    const key = (i: number) => [prepared[i].sigmaDeg, prepared[i].lat, prepared[i].lon, prepared[i].azimuthDeg];
    const rep = g.reduce((a, b) => (compareKeys(key(b), key(a)) < 0 ? b : a), g[0]);
    for (const i of g) if (i !== rep) repeated.add(i);
    const ids = g.map((i) => prepared[i].name);
    notices.push({ code: 'duplicate-lines', ids, message: `Lines ${ids.join(', ')} look like the same bearing entered more than once (same spot, same direction): counted once.` });
  }
  const used = prepared.filter((_, i) => !repeated.has(i));
  if (used.length < 2) {
    return { ok: false, reason: 'too-few-lines', message: 'A fix needs at least two bearings from different spots (repeated entries of one bearing count once).' };
  }

  const all = solveAll(used);
  if (!all.ok) return onlyBehind(used) ?? all;
  if (!crossesUsably(all)) return onlyBehind(used) ?? parallel(used.length);

  // which lines to set aside
  const choice = chooseLines(used, all);
  let main: Solution = all;
  let kept = used;
  if (choice.removed.length > 0) {
    const keptLines = choice.kept.map((i) => used[i]);
    const solved = choice.solution ?? solveLines(keptLines, { lat: all.lat, lon: all.lon });
    if (solved.ok && crossesUsably(solved)) { main = solved; kept = keptLines; }
    else { choice.removed = []; choice.ambiguous = true; }
  }
  const removedIds = choice.removed.map((i) => used[i].name);

  // one-way lines: the source is ahead of each kept one; when the constrained solve is poor
  // (inconsistent, or stuck on a one-way observer) but the lines agree behind one, refuse
  const stuck = main.rows.some((r) => r.line.oneWay && r.rangeM < AT_OBSERVER_M);
  if (behindAny(main).length > 0 || stuck || (main.cost > chiSquareUpper(CONSISTENCY_ALPHA, Math.max(kept.length - 2, 1)) && kept.some((l) => l.oneWay))) {
    const refusal = onlyBehind(kept);
    if (refusal) return refusal;
  }

  // honest size: variance factor, then the likelihood region when the ellipse misdescribes it
  const factor = varianceFactor(main.cost, kept.length);
  let ellipse = scaled(ellipseFromNormal(main.normal, confidence) as Ellipse, Math.sqrt(factor));
  if (choice.ambiguous && choice.candidates && choice.plane) {
    // cannot tell which line is wrong: the source is near one of the consistent subsets' fixes;
    // the covariance adds their spread about the fix (a mixture of the candidates, equal weights)
    ellipse = mixtureEllipse(main, factor, choice.candidates, choice.plane, confidence);
  }
  const region = choice.ambiguous && choice.candidates ? null : regionFor(kept, main, ellipse, factor, confidence);
  if (region && region.grow > 1) ellipse = scaled(ellipse, region.grow);

  if (removedIds.length > 0) {
    notices.push({
      code: 'lines-set-aside',
      ids: removedIds,
      message: `${removedIds.length === 1 ? `Line ${removedIds[0]} disagrees` : `Lines ${removedIds.join(', ')} disagree`} with the others (a reflection, or a misread?) and ${removedIds.length === 1 ? 'is' : 'are'} set aside; the fix with every line is shown as the alternative.`,
    });
  }
  const dof = kept.length - 2;
  const disagree = dof >= 1 && main.cost > chiSquareUpper(CONSISTENCY_ALPHA, dof);
  if (choice.ambiguous || (disagree && removedIds.length === 0)) {
    const suspects = choice.suspects.map((i) => used[i].name);
    notices.push({
      code: 'cannot-tell-which',
      ...(suspects.length ? { ids: suspects } : {}),
      message: used.length === 3
        ? 'These three lines disagree more than their sigmas allow, and with only three lines the odd one out cannot be singled out: take a fourth bearing from a new side. The ellipse has been widened.'
        : 'These lines disagree, and they cannot tell which one is wrong: take one more bearing from a new side. The ellipse has been widened.',
    });
  } else if (factor > 1) {
    notices.push({ code: 'lines-disagree', message: 'The lines disagree more than their stated sigmas allow (a reflection, or sigmas too optimistic?): the ellipse has been widened. One more bearing from a new side would tell.' });
  }
  if (region?.open) {
    notices.push({ code: 'open-region', message: 'The lines barely cross: the source could lie much farther along them. Take a bearing from well to the side.' });
  }
  const near = main.rows.filter((r) => r.rangeM < AT_OBSERVER_M);
  if (near.length > 0) {
    const ids = near.map((r) => r.line.name);
    notices.push({ code: 'fix-at-observer', ids, message: `The fix lies within ${AT_OBSERVER_M} m of where line ${ids.join(', ')} was taken: check that bearing, or take one more from a new side.` });
  }

  const allLines: FixEstimate | undefined = removedIds.length > 0
    ? { lat: all.lat, lon: all.lon, ellipse: scaled(ellipseFromNormal(all.normal, confidence) as Ellipse, Math.sqrt(varianceFactor(all.cost, used.length))) }
    : undefined;
  const setAside = new Set([...choice.removed.map((i) => used[i].index), ...repeated]);
  // every input line at the fix itself (the solution's rows were linearised one step before it)
  const at = rowsAt(prepared, main.lat, main.lon).rows;
  const maxRange = Math.max(...main.rows.map((r) => r.rangeM));
  const drawnLength = Math.min(MAX_DRAWN_LENGTH_M, Math.max(3 * maxRange, 100));
  const fix: OkFix = {
    ok: true,
    lat: main.lat,
    lon: main.lon,
    ellipse,
    ...(region ? { region: region.ring } : {}),
    varianceFactor: factor,
    residuals: at.map((r) => {
      const offsetDeg = bearingResidualDeg(r.aziFromObserverDeg, r.line.azimuthDeg, r.line.oneWay);
      return { id: r.line.id, offsetDeg, sigmas: Math.abs(offsetDeg) / r.line.sigmaDeg, ...(setAside.has(r.line.index) ? { setAside: true } : {}) };
    }),
    outlierIds: removedIds,
    ...(allLines ? { allLines } : {}),
    intersections: pairwiseIntersections(prepared, drawnLength, main.lon),
    warnings: notices.map((n) => n.message),
    notices,
  };
  return fix;
}

function compareKeys(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}

/** 95 % ellipse of the fix's covariance (times factor) plus the spread of candidate fixes about it. */
function mixtureEllipse(main: Solution, factor: number, candidates: [number, number][], plane: Plane, confidence: number): Ellipse {
  const cov = invertSym2(main.normal) as [number, number, number];
  const [e0, n0] = approxEastNorth(plane.originLat, plane.originLon, main.lat, main.lon);
  let a = factor * cov[0], b = factor * cov[1], c = factor * cov[2];
  for (const [e, n] of candidates) {
    const dE = e - e0, dN = n - n0;
    a += (dE * dE) / candidates.length; b += (dE * dN) / candidates.length; c += (dN * dN) / candidates.length;
  }
  const info = invertSym2([a, b, c]);
  return (info && ellipseFromNormal(info, confidence)) || scaled(ellipseFromNormal(main.normal, confidence) as Ellipse, Math.sqrt(factor));
}

/** Robust choice of lines, with the kept lines' solution when it was already solved. */
function chooseLines(lines: PreparedLine[], all: Solution): RobustChoice & { solution?: Solution; plane?: Plane } {
  const n = lines.length;
  const keepAll: RobustChoice = { kept: Array.from({ length: n }, (_, i) => i), removed: [], ambiguous: false, suspects: [] };
  if (n < 4) return keepAll;
  if (consistent(all, n)) return keepAll;
  const plane = toPlane(lines, all.lat, all.lon);
  if (n <= EXHAUSTIVE_MAX_LINES) {
    const choice = chooseBySubsets(plane);
    if (choice.removed.length === 0 || !choice.x) return { ...choice, plane };
    const keptLines = choice.kept.map((i) => lines[i]);
    const solved = solveLines(keptLines, fromPlane(plane, choice.x));
    return solved.ok ? { ...choice, solution: solved } : { ...keepAll, ambiguous: true };
  }
  const { choice, solution } = chooseByRejection(lines, plane, all);
  return choice.removed.length > 0 ? { ...choice, solution } : choice;
}

/** Clean-data fast path: chi-square passes and no single line stands out (rank-one downdate). */
function consistent(all: Solution, n: number): boolean {
  if (all.cost > chiSquareUpper(CONSISTENCY_ALPHA, n - 2)) return false;
  const inv = invertSym2(all.normal);
  if (!inv) return true;
  const threshold = chiSquareUpper(CONSISTENCY_ALPHA / n, 1);
  for (const { jE, jN, residualRad, line } of all.rows) {
    const h = line.weight * (jE * (inv[0] * jE + inv[1] * jN) + jN * (inv[1] * jE + inv[2] * jN));
    if (1 - h > 1e-6 && (line.weight * residualRad * residualRad) / (1 - h) > threshold) return false;
  }
  return true;
}

