/**
 * Decimal year of an instant (UTC), as the World Magnetic Model counts time: the year plus the
 * elapsed fraction of that calendar year (365 or 366 days). 2027-07-02T12:00Z -> 2027.5.
 * @param date the instant
 * @returns decimal year; NaN for an invalid Date
 */
export function dateToDecimalYear(date: Date): number {
  const t = date instanceof Date ? date.getTime() : NaN;
  if (!Number.isFinite(t)) return NaN;
  const year = date.getUTCFullYear();
  const start = Date.UTC(year, 0, 1);
  const next = Date.UTC(year + 1, 0, 1);
  return year + (t - start) / (next - start);
}
