import { estimateFix } from './estimate-fix';
import { DEG, wrapDeg180 } from './internal/angles';
import { approxEastNorth, geodesicDirect, geodesicInverse } from './internal/geodesy';
import { fromPlane, normalAt, toPlane, type Plane } from './internal/plane';
import { lineProblem, prepareLine, type PreparedLine } from './internal/prepare-lines';
import { chiSquare2Scale } from './internal/statistics';
import { eigenSym2, invertSym2, type Sym2 } from './internal/sym2';
import { nearFieldRadiusM } from './near-field-radius-m';
import type { LineOfBearing, NextSpot, NextSpotOptions } from './types';

const RADII = 8;
const AZIMUTHS = 48;
/** Never closer to the fix than this, metres (common practice, no source). */
const MIN_DISTANCE_M = 50;
/** Times the current 95 % semi-major: spots stay well outside the ellipse. */
const SEMI_MAJOR_FACTOR = 1.5;
/** Times the reactive near-field radius lambda / 2 pi. */
const NEAR_FIELD_FACTOR = 3;
/** With a single line the source is assumed this far along it, metres. */
const ASSUMED_RANGE_M = 700;
const DEFAULT_MAX_RANGE_M = 2000;
const DEFAULT_MAX_WALK_M = 1000;
const K95 = chiSquare2Scale(0.95);
/** Unscented-transform sigma points in 2-D with kappa = 1 (Julier & Uhlmann 1997): radius sqrt(3), weights 1/3 and 1/6. */
const SIGMA_RADIUS = Math.sqrt(3);
const SIGMA_WEIGHTS = [1 / 3, 1 / 6, 1 / 6, 1 / 6, 1 / 6];

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

type State = { lat: number; lon: number; cov: Sym2; semiMajorM: number; lines: PreparedLine[] };

/** Where the source is now believed to be: the robust fix and its covariance (east/north m^2). */
function currentState(lines: LineOfBearing[], prepared: PreparedLine[]): State {
  const fix = lines.length >= 2 ? estimateFix(lines) : null;
  if (fix?.ok) {
    const a = fix.ellipse.semiMajorM / chiSquare2Scale(fix.ellipse.confidence);
    const b = fix.ellipse.semiMinorM / chiSquare2Scale(fix.ellipse.confidence);
    const t = fix.ellipse.majorAxisAzimuthDeg * DEG;
    const u = [Math.sin(t), Math.cos(t)], v = [Math.cos(t), -Math.sin(t)];
    const cov: Sym2 = [a * a * u[0] * u[0] + b * b * v[0] * v[0], a * a * u[0] * u[1] + b * b * v[0] * v[1], a * a * u[1] * u[1] + b * b * v[1] * v[1]];
    const kept = prepared.filter((_, i) => !fix.residuals[i]?.setAside);
    return { lat: fix.lat, lon: fix.lon, cov, semiMajorM: K95 * a, lines: kept };
  }
  // one line (or no usable crossing): the source some way along the sharpest line, unknown along it
  const line = prepared.reduce((a, b) => (b.sigmaDeg < a.sigmaDeg ? b : a));
  const p = geodesicDirect(line.lat, line.lon, line.azimuthDeg, ASSUMED_RANGE_M);
  const t = p.azi2 * DEG;
  const along = ASSUMED_RANGE_M / 2, across = ASSUMED_RANGE_M * line.sigmaDeg * DEG;
  const u = [Math.sin(t), Math.cos(t)], v = [Math.cos(t), -Math.sin(t)];
  const cov: Sym2 = [along ** 2 * u[0] ** 2 + across ** 2 * v[0] ** 2, along ** 2 * u[0] * u[1] + across ** 2 * v[0] * v[1], along ** 2 * u[1] ** 2 + across ** 2 * v[1] ** 2];
  return { lat: p.lat, lon: p.lon, cov, semiMajorM: K95 * along, lines: [line] };
}

/** Sigma points of the source's current distribution, plane metres around the fix. */
function sigmaPoints(cov: Sym2): [number, number][] {
  const e = eigenSym2(cov);
  const a = Math.sqrt(Math.max(e.major, 0)) * SIGMA_RADIUS, b = Math.sqrt(Math.max(e.minor, 0)) * SIGMA_RADIUS;
  const u = [e.vx, e.vy], v = [-e.vy, e.vx];
  return [[0, 0], [a * u[0], a * u[1]], [-a * u[0], -a * u[1]], [b * v[0], b * v[1]], [-b * v[0], -b * v[1]]];
}

/** 95 % ellipse area (m^2) at source s after adding a line of weight w from c, given the other lines' information there. */
function areaWith(normal: Sym2, w: number, c: [number, number], s: [number, number]): number {
  const dE = s[0] - c[0], dN = s[1] - c[1];
  const rho2 = Math.max(dE * dE + dN * dN, 1);
  const jE = dN / rho2, jN = -dE / rho2;
  const m: Sym2 = [normal[0] + w * jE * jE, normal[1] + w * jE * jN, normal[2] + w * jN * jN];
  const det = m[0] * m[2] - m[1] * m[1];
  return det > 0 ? (Math.PI * K95 * K95) / Math.sqrt(det) : Infinity;
}

function semiMajorWith(normal: Sym2, w: number, c: [number, number]): number {
  const rho2 = Math.max(c[0] * c[0] + c[1] * c[1], 1);
  const jE = -c[1] / rho2, jN = c[0] / rho2;
  const cov = invertSym2([normal[0] + w * jE * jE, normal[1] + w * jE * jN, normal[2] + w * jN * jN]);
  return cov ? K95 * Math.sqrt(Math.max(eigenSym2(cov).major, 0)) : Infinity;
}

/**
 * Where to take the next bearing. Candidates lie on rings around the current (robust) fix, at
 * least max(1.5 x the 95 % semi-major, 3 x lambda / 2 pi at frequencyHz, 50 m) away, so outside
 * the ellipse and out of the source's reactive near field. Each is scored by the expected 95 %
 * ellipse AREA after one more line from there, averaged over where the source may be (sigma points
 * of the current covariance, Julier & Uhlmann 1997) rather than at the point estimate only, with
 * the median sigma of the lines so far (information-matrix update, no re-solve). Suggestions give
 * different lines: no two lie on the same line through the fix (no mirror pairs), at least
 * min(30, 180 / (count + 1)) degrees apart as lines. With `from`, only spots within maxWalkM of it
 * are offered while any exist, and each carries its straight-line walking distance.
 * @param lines bearings so far
 * @param opts count (default 3), frequencyHz, from (WGS84 degrees), maxWalkM (default 1000 m), maxRangeM (default 2000 m)
 * @returns spots in WGS84 degrees, best first; [] for no or invalid lines
 */
export function suggestNextSpots(lines: LineOfBearing[], opts?: NextSpotOptions): NextSpot[] {
  if (!Array.isArray(lines) || lines.length === 0) return [];
  const count = Math.min(Math.round(opts?.count ?? 3), 50);
  if (!(count >= 1)) return [];
  if (lines.some((l, i) => lineProblem(l, i) !== null)) return [];
  const from = opts?.from && Number.isFinite(opts.from.lat) && Number.isFinite(opts.from.lon) && Math.abs(opts.from.lat) <= 90 ? opts.from : undefined;
  const maxWalkM = opts?.maxWalkM ?? DEFAULT_MAX_WALK_M;
  const prepared = lines.map(prepareLine);
  const state = currentState(lines, prepared);
  const f = opts?.frequencyHz;
  const nearField = typeof f === 'number' && Number.isFinite(f) && f > 0 ? NEAR_FIELD_FACTOR * nearFieldRadiusM(f) : 0;
  const minM = Math.max(SEMI_MAJOR_FACTOR * state.semiMajorM, nearField, MIN_DISTANCE_M);
  const maxM = Math.max(opts?.maxRangeM ?? DEFAULT_MAX_RANGE_M, 3 * minM);
  const plane: Plane = toPlane(state.lines, state.lat, state.lon);
  const sigmaRad = median(prepared.map((l) => l.sigmaDeg)) * DEG;
  const w = 1 / (sigmaRad * sigmaRad);
  const samples = sigmaPoints(state.cov);
  const normals = samples.map((s) => normalAt(plane, s));
  const home = from ? approxEastNorth(state.lat, state.lon, from.lat, from.lon) : null;

  type Candidate = { x: [number, number]; area: number; lineDeg: number; walkM?: number };
  const points: [number, number][] = [];
  for (let i = 0; i < RADII; i++) {
    const r = minM * Math.pow(maxM / minM, i / (RADII - 1));
    for (let k = 0; k < AZIMUTHS; k++) {
      const t = (2 * Math.PI * (k + (i % 2) / 2)) / AZIMUTHS;
      points.push([r * Math.sin(t), r * Math.cos(t)]);
    }
  }
  if (home) {
    // also rings around the hunter, so a short walk has choices
    for (const frac of [0.25, 0.5, 0.75, 1]) {
      for (let k = 0; k < AZIMUTHS; k++) {
        const t = (2 * Math.PI * k) / AZIMUTHS;
        const x: [number, number] = [home[0] + frac * maxWalkM * Math.sin(t), home[1] + frac * maxWalkM * Math.cos(t)];
        if (Math.hypot(x[0], x[1]) >= minM) points.push(x);
      }
    }
  }
  let candidates: Candidate[] = points.map((x) => {
    let area = 0;
    samples.forEach((s, j) => { area += SIGMA_WEIGHTS[j] * areaWith(normals[j], w, x, s); });
    const lineDeg = ((Math.atan2(x[0], x[1]) / DEG) % 180 + 180) % 180;
    return { x, area, lineDeg, ...(home ? { walkM: Math.hypot(x[0] - home[0], x[1] - home[1]) } : {}) };
  }).filter((c) => Number.isFinite(c.area));
  if (home) {
    const reachable = candidates.filter((c) => (c.walkM as number) <= maxWalkM);
    if (reachable.length > 0) candidates = reachable;
  }
  candidates.sort((a, b) => a.area - b.area || (a.walkM ?? 0) - (b.walkM ?? 0));

  const separation = Math.min(30, 180 / (count + 1));
  const chosen: Candidate[] = [];
  for (const c of candidates) {
    if (chosen.length >= count) break;
    if (chosen.every((o) => Math.abs(wrapDeg180(2 * (c.lineDeg - o.lineDeg))) / 2 >= separation - 1e-9)) chosen.push(c);
  }
  const centreNormal = normalAt(plane, [0, 0]);
  return chosen.map((c) => {
    const p = fromPlane(plane, c.x);
    const spot: NextSpot = {
      lat: p.lat,
      lon: p.lon,
      expectedSemiMajorM: semiMajorWith(centreNormal, w, c.x),
      expectedAreaM2: c.area,
      distanceFromFixM: geodesicInverse(state.lat, state.lon, p.lat, p.lon).s12,
    };
    if (from) spot.walkM = geodesicInverse(from.lat, from.lon, p.lat, p.lon).s12;
    return spot;
  });
}
