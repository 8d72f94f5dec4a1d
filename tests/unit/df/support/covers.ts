import { booleanPointInPolygon, point, polygon } from '@turf/turf';
import type { Fix } from '@/lib/df';
import { insideEllipse } from './scene';

/** Whether the fix's stated region holds p: the likelihood region when given, else the ellipse. */
export function covers(fix: Extract<Fix, { ok: true }>, p: { lat: number; lon: number }): boolean {
  if (fix.region) return booleanPointInPolygon(point([p.lon, p.lat]), polygon([fix.region]));
  return insideEllipse(fix, fix.ellipse, p);
}
