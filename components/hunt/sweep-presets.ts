import { normalizeDeg } from './number-text';

/**
 * Loop axis angles for a quick sweep, degrees. A small loop's pattern repeats every 180°, so
 * 0–170 in 10° steps covers it all; around a rough null, 7 readings 10° apart cover ±30°
 * (common practice, no source).
 */
export function everyTenDegrees(): number[] {
  return Array.from({ length: 18 }, (_, k) => k * 10);
}

/** Seven angles from roughNullDeg − 30° to + 30° in 10° steps, each in [0, 360). */
export function aroundRoughNull(roughNullDeg: number): number[] {
  return [-30, -20, -10, 0, 10, 20, 30].map((d) => normalizeDeg(roughNullDeg + d));
}
