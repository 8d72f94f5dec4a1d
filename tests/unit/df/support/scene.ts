/**
 * Test scenes built with GeographicLib (Karney 2013) as the geodesic truth: observers placed by
 * Geodesic.WGS84.Direct from a chosen source, bearings = azimuth observer -> source by Inverse.
 * All coordinates used with these helpers are open sea or open land (invented, demo only).
 */
import { Geodesic } from 'geographiclib-geodesic';
import type { LineOfBearing } from '@/lib/df';

export type Spot = { fromSourceAzDeg: number; rangeM: number; sigmaDeg?: number; oneWay?: boolean };

export { mulberry32 } from '../../../support/random';

/** Standard normal deviates by Box-Muller from a uniform source. */
export function gaussian(rand: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
}

/** Exact lines of bearing toward the source (GeographicLib Inverse), optional bearing noise. */
export function sceneLines(source: { lat: number; lon: number }, spots: Spot[], noise?: () => number): LineOfBearing[] {
  return spots.map((s, i) => {
    const obs = Geodesic.WGS84.Direct(source.lat, source.lon, s.fromSourceAzDeg, s.rangeM);
    const inv = Geodesic.WGS84.Inverse(obs.lat2 as number, obs.lon2 as number, source.lat, source.lon);
    const sigmaDeg = s.sigmaDeg ?? 3;
    const azimuthDeg = (inv.azi1 as number) + (noise ? noise() * sigmaDeg : 0);
    return { id: `L${i}`, lat: obs.lat2 as number, lon: obs.lon2 as number, azimuthDeg, sigmaDeg, oneWay: s.oneWay };
  });
}

/** Geodesic distance in metres (GeographicLib). */
export function distanceM(a: { lat: number; lon: number }, b: { lat: number; lon: number }): number {
  return Geodesic.WGS84.Inverse(a.lat, a.lon, b.lat, b.lon).s12 as number;
}

/** Whether point p lies inside the ellipse (semi-axes metres, major-axis azimuth degrees) centred at c. */
export function insideEllipse(
  c: { lat: number; lon: number },
  e: { semiMajorM: number; semiMinorM: number; majorAxisAzimuthDeg: number },
  p: { lat: number; lon: number },
): boolean {
  const inv = Geodesic.WGS84.Inverse(c.lat, c.lon, p.lat, p.lon);
  const along = ((inv.azi1 as number) - e.majorAxisAzimuthDeg) * (Math.PI / 180);
  const s = inv.s12 as number;
  const x = (s * Math.cos(along)) / e.semiMajorM;
  const y = (s * Math.sin(along)) / e.semiMinorM;
  return x * x + y * y <= 1;
}
