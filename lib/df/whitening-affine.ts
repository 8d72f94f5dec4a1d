import { DEG } from './internal/angles';
import type { Ellipse } from './types';

/** Coefficients of x' = a·lon + b·lat + xoff, y' = d·lon + e·lat + yoff (PostGIS ST_Affine's 2-D order). */
export type WhiteningAffine = { a: number; b: number; d: number; e: number; xoff: number; yoff: number };

/**
 * Radius of a `confidence` region of a 2-D normal in standard deviations: sqrt of the chi-square
 * quantile with 2 degrees of freedom, sqrt(-2 ln(1 - p)) (2.4477 for 95 %).
 */
export function confidenceRadius(confidence: number): number {
  return Math.sqrt(-2 * Math.log(1 - confidence));
}

/**
 * The affine map from WGS84 longitude/latitude (degrees) to "whitened" coordinates of a fix:
 * east/north metres in the tangent plane at the centre (radii of curvature of the WGS84
 * ellipsoid there), turned onto the ellipse axes and divided by each axis' standard deviation.
 * The distance from the origin after the map is the Mahalanobis distance; the ellipse itself
 * becomes the circle of radius {@link confidenceRadius}(ellipse.confidence). Good to a fraction of
 * a percent within a few km of the centre.
 * @param center fix centre, WGS84 degrees
 * @param ellipse semi-axes in metres at `ellipse.confidence`, major-axis azimuth in degrees clockwise from true north
 * @returns the map's coefficients, or null for unusable input (zero axes, non-finite values)
 */
export function whiteningAffine(center: { lat: number; lon: number }, ellipse: Ellipse): WhiteningAffine | null {
  const k = confidenceRadius(ellipse.confidence);
  const vals = [center.lat, center.lon, ellipse.semiMajorM, ellipse.semiMinorM, ellipse.majorAxisAzimuthDeg, k];
  if (!vals.every(Number.isFinite) || ellipse.semiMinorM <= 0 || ellipse.semiMajorM <= 0 || Math.abs(center.lat) >= 90) return null;
  const A = 6378137; // WGS84 semi-major axis, metres
  const E2 = 0.00669437999014; // WGS84 first eccentricity squared
  const phi = center.lat * DEG;
  const w = 1 - E2 * Math.sin(phi) ** 2;
  const mPerDegLon = (A / Math.sqrt(w)) * Math.cos(phi) * DEG;
  const mPerDegLat = ((A * (1 - E2)) / (w * Math.sqrt(w))) * DEG;
  const az = ellipse.majorAxisAzimuthDeg * DEG;
  const sa = ellipse.semiMajorM / k;
  const sb = ellipse.semiMinorM / k;
  // major axis unit vector (east, north) = (sin az, cos az); minor = (cos az, -sin az)
  const a = (Math.sin(az) * mPerDegLon) / sa;
  const b = (Math.cos(az) * mPerDegLat) / sa;
  const d = (Math.cos(az) * mPerDegLon) / sb;
  const e = (-Math.sin(az) * mPerDegLat) / sb;
  return { a, b, d, e, xoff: -(a * center.lon + b * center.lat), yoff: -(d * center.lon + e * center.lat) };
}
