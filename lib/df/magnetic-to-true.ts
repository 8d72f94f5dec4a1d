import { declinationDeg } from './declination-deg';
import { normalizeDeg360 } from './internal/angles';

/**
 * Converts a compass (magnetic) bearing to a true bearing: true = magnetic + declination
 * (World Magnetic Model 2025 at the observer's place and date).
 * @param azimuthDeg degrees clockwise from magnetic north
 * @param lat observer latitude, WGS84 degrees
 * @param lon observer longitude, degrees east
 * @param date the instant of the bearing
 * @returns degrees clockwise from true north, in [0, 360); NaN for unusable input
 */
export function magneticToTrue(azimuthDeg: number, lat: number, lon: number, date: Date): number {
  const d = declinationDeg(lat, lon, date);
  if (!Number.isFinite(azimuthDeg) || !Number.isFinite(d)) return NaN;
  return normalizeDeg360(azimuthDeg + d);
}
