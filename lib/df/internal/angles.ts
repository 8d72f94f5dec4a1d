/** Angle helpers (degrees). */

export const DEG = Math.PI / 180;

/** Any finite angle in degrees -> [0, 360). */
export function normalizeDeg360(deg: number): number {
  const r = deg % 360;
  const v = r < 0 ? r + 360 : r;
  return v === 360 ? 0 : v;
}

/** Any finite angle in degrees -> (-180, 180]. */
export function wrapDeg180(deg: number): number {
  const v = normalizeDeg360(deg);
  return v > 180 ? v - 360 : v;
}

/**
 * Residual of a bearing in degrees. A two-way line (loop null) is a line, so its residual is
 * folded into (-90, 90]: reading it 180 degrees the other way changes nothing.
 */
export function bearingResidualDeg(observedAzimuthDeg: number, lineAzimuthDeg: number, oneWay: boolean): number {
  const r = wrapDeg180(observedAzimuthDeg - lineAzimuthDeg);
  if (oneWay) return r;
  if (r > 90) return r - 180;
  if (r <= -90) return r + 180;
  return r;
}

/** Any finite angle -> [0, 180), for axes that have no sense. */
export function foldDeg180(deg: number): number {
  const v = normalizeDeg360(deg) % 180;
  return v === 180 ? 0 : v;
}
