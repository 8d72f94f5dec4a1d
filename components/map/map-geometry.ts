/** Pure helpers for drawing a case on the map (no Leaflet). Distances in metres, positions WGS84 degrees. */
import { distance, point } from '@turf/turf';

/** Drawn length of a line of bearing when there is no fix to scale it by, metres. */
export const DEFAULT_LINE_LENGTH_M = 3000;
/** Shortest and longest drawn line (each way), metres. */
const MIN_LINE_LENGTH_M = 200;
const MAX_LINE_LENGTH_M = 50_000;
/** Lines reach this many times the observer-to-fix distance, so they visibly cross beyond the fix. */
const LENGTH_PER_FIX_DISTANCE = 2.5;

/** Great-circle distance between two positions, metres (spherical earth; fine for drawing). */
export function distanceM(a: { lat: number; lon: number }, b: { lat: number; lon: number }): number {
  return distance(point([a.lon, a.lat]), point([b.lon, b.lat]), { units: 'meters' });
}

/**
 * How far to draw a bearing from its observer (each way), metres: 2.5 x the distance to the fix
 * when there is one, else 3 km; kept between 200 m and 50 km.
 */
export function bearingDrawLengthM(observer: { lat: number; lon: number }, fix?: { lat: number; lon: number } | null): number {
  if (!fix) return DEFAULT_LINE_LENGTH_M;
  const d = distanceM(observer, fix);
  if (!Number.isFinite(d)) return DEFAULT_LINE_LENGTH_M;
  return Math.min(Math.max(d * LENGTH_PER_FIX_DISTANCE, MIN_LINE_LENGTH_M), MAX_LINE_LENGTH_M);
}

/**
 * A distance in metres as a short rounded label: "~40 m", "~350 m", "~1.2 km" (5 m steps below
 * 100 m, 10 m steps below 1 km, then 0.1 km).
 */
export function formatApproxMetres(m: number): string {
  if (!Number.isFinite(m) || m < 0) return '?';
  if (m < 100) return `~${Math.max(5, Math.round(m / 5) * 5)} m`;
  if (m < 995) return `~${Math.round(m / 10) * 10} m`;
  return `~${(m / 1000).toFixed(1)} km`;
}
