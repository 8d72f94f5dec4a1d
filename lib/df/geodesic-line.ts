import { geodesicPoints } from './internal/geodesy';
import { normalizeDeg360 } from './internal/angles';
import type { LineOfBearing } from './types';

/**
 * Points along a line of bearing for drawing: the geodesic from the observer both ways
 * (-lengthM .. +lengthM), or one way (0 .. lengthM) for a one-way line.
 * Longitudes are continuous along the line (they may pass 180 rather than jump to -180).
 * @param line the bearing (observer WGS84 degrees, azimuth degrees clockwise from true north)
 * @param lengthM length on each side in metres
 * @param steps number of segments on each side (1..1000, default 32)
 * @returns [lat, lon] pairs in degrees; [] for unusable input
 */
export function geodesicLine(line: LineOfBearing, lengthM: number, steps = 32): [number, number][] {
  const ok = line && [line.lat, line.lon, line.azimuthDeg, lengthM, steps].every(Number.isFinite) && Math.abs(line.lat) <= 90;
  if (!ok || lengthM <= 0) return [];
  const n = Math.min(Math.max(Math.round(steps), 1), 1000);
  const distances: number[] = [];
  for (let k = line.oneWay ? 0 : -n; k <= n; k++) distances.push((k / n) * lengthM);
  return geodesicPoints(line.lat, line.lon, normalizeDeg360(line.azimuthDeg), distances);
}
