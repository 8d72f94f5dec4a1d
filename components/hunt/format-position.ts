/**
 * A WGS84 position in words: "51.12345° N, 4.56789° E". Five decimals of a degree are about a
 * metre, finer than any phone fix.
 */
export function formatLatLon(lat: number, lon: number): string {
  const ns = lat >= 0 ? 'N' : 'S';
  const ew = lon >= 0 ? 'E' : 'W';
  return `${Math.abs(lat).toFixed(5)}° ${ns}, ${Math.abs(lon).toFixed(5)}° ${ew}`;
}
