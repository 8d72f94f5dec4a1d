/**
 * Instant (UTC) of a decimal year, the inverse of dateToDecimalYear: 2027.5 -> 2027-07-02T12:00Z.
 * @param decimalYear e.g. 2025.0
 * @returns the Date (invalid Date for a non-finite input)
 */
export function decimalYearToDate(decimalYear: number): Date {
  if (!Number.isFinite(decimalYear)) return new Date(NaN);
  const year = Math.floor(decimalYear);
  const start = Date.UTC(year, 0, 1);
  const next = Date.UTC(year + 1, 0, 1);
  return new Date(Math.round(start + (decimalYear - year) * (next - start)));
}
