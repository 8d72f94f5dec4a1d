/**
 * Coordinate grid for the map when tiles are off: pure helpers (no Leaflet), all angles in
 * decimal degrees of WGS84 latitude/longitude.
 */

/** Nice grid steps in degrees, smallest first: 1, 2, 5 x 10^k from about 1 m up to 30 degrees. */
const STEPS_DEG = [1e-5, 2e-5, 5e-5, 1e-4, 2e-4, 5e-4, 1e-3, 2e-3, 5e-3, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 30];

/**
 * Grid spacing for a visible span: the smallest nice step that gives at most `maxLines` lines.
 * @param spanDeg visible extent along one axis, degrees (longitude or latitude)
 * @param maxLines most lines wanted across that span (default 6)
 * @returns step in degrees; 30 for a span wider than the ladder covers, NaN for unusable input
 */
export function gridSpacingDeg(spanDeg: number, maxLines = 6): number {
  if (!Number.isFinite(spanDeg) || spanDeg <= 0 || !(maxLines >= 1)) return NaN;
  return STEPS_DEG.find((s) => spanDeg / s <= maxLines) ?? STEPS_DEG[STEPS_DEG.length - 1];
}

/**
 * Longitude span in degrees that a map `widthPx` pixels wide shows at a Web Mercator zoom level
 * (256-pixel tiles: 360 degrees across 256 * 2^zoom pixels).
 */
export function lonSpanAtZoomDeg(zoom: number, widthPx: number): number {
  return (widthPx * 360) / (256 * 2 ** zoom);
}

/**
 * Multiples of `step` from `min` to `max` (both in degrees), in increasing order; at most 200.
 */
export function gridValues(min: number, max: number, step: number): number[] {
  if (![min, max, step].every(Number.isFinite) || step <= 0 || max < min) return [];
  const first = Math.ceil(min / step);
  const last = Math.floor(max / step);
  const out: number[] = [];
  for (let k = first; k <= last && out.length < 200; k++) out.push(Number((k * step).toFixed(10)));
  return out;
}

/** Decimals needed to show multiples of a step exactly (0.005 -> 3). */
function decimalsFor(step: number): number {
  return Math.max(0, Math.ceil(-Math.log10(step) - 1e-9));
}

/**
 * Label of a grid line: "51.125° N", "0.5° W", "0°". Longitudes are wrapped into (-180, 180].
 * @param value degrees
 * @param step the grid step in degrees (sets the number of decimals)
 * @param axis 'lat' (N/S) or 'lon' (E/W)
 */
export function formatGridLabel(value: number, step: number, axis: 'lat' | 'lon'): string {
  let v = value;
  if (axis === 'lon') {
    v = ((((v + 180) % 360) + 360) % 360) - 180;
    if (v === -180) v = 180;
  }
  const text = Math.abs(v).toFixed(decimalsFor(step));
  if (Number(text) === 0) return `${text}°`;
  const hemisphere = axis === 'lat' ? (v > 0 ? 'N' : 'S') : v > 0 ? 'E' : 'W';
  return `${text}° ${hemisphere}`;
}
