import { declinationInfo } from './declination-info';

/**
 * Magnetic declination (World Magnetic Model 2025), degrees east positive. NaN for unusable input.
 * See declinationInfo for the validity warning.
 * @param lat geodetic latitude, WGS84 degrees
 * @param lon longitude, degrees east
 * @param date the instant of the bearing
 * @param altitudeKm height above the ellipsoid in kilometres, default 0
 */
export function declinationDeg(lat: number, lon: number, date: Date, altitudeKm?: number): number {
  return declinationInfo(lat, lon, date, altitudeKm).declinationDeg;
}
