import { offsetEastNorth } from './internal/geodesy';
import { DEG } from './internal/angles';
import type { Ellipse } from './types';

/**
 * Ring of points on an error ellipse, for drawing.
 * @param center centre in WGS84 degrees
 * @param ellipse semi-axes in metres, major-axis azimuth in degrees clockwise from true north
 * @param n number of distinct points (3..1000, default 72)
 * @returns closed ring of [lat, lon] pairs in degrees (first point repeated last); [] for unusable input
 */
export function ellipsePolygon(center: { lat: number; lon: number }, ellipse: Ellipse, n = 72): [number, number][] {
  const ok = center && ellipse && [center.lat, center.lon, ellipse.semiMajorM, ellipse.semiMinorM, ellipse.majorAxisAzimuthDeg, n].every(Number.isFinite);
  if (!ok || Math.abs(center.lat) > 90 || ellipse.semiMajorM < 0 || ellipse.semiMinorM < 0) return [];
  const count = Math.min(Math.max(Math.round(n), 3), 1000);
  const az = ellipse.majorAxisAzimuthDeg * DEG;
  // unit vectors (east, north) of the major and minor axes
  const major = [Math.sin(az), Math.cos(az)];
  const minor = [Math.cos(az), -Math.sin(az)];
  const ring: [number, number][] = [];
  for (let k = 0; k < count; k++) {
    const t = (2 * Math.PI * k) / count;
    const a = ellipse.semiMajorM * Math.cos(t);
    const b = ellipse.semiMinorM * Math.sin(t);
    const p = offsetEastNorth(center.lat, center.lon, a * major[0] + b * minor[0], a * major[1] + b * minor[1]);
    ring.push([p.lat, p.lon]);
  }
  ring.push(ring[0]);
  return ring;
}
