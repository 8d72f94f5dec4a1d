/**
 * The strongest single reading of a trail or survey: the first point with the highest level in
 * dBm, by the level the caller converts to (S-units and dBm compare only once converted). Raw
 * readings, unlike lib/df trailPeak, which smooths over neighbours. Pure; used by the server and
 * the map.
 */
export function strongestPoint<P>(points: readonly P[], toDbm: (p: P) => number): P | null {
  return points.reduce<P | null>((best, p) => (Number.isFinite(toDbm(p)) && (!best || toDbm(p) > toDbm(best)) ? p : best), null);
}
