/**
 * Impedance ratio of a transformer from its turns: Zsecondary / Zprimary = (Nsecondary / Nprimary)^2
 * (common practice). 4 and 12 turns -> 9 (1:9).
 * @param primaryTurns turns on the primary
 * @param secondaryTurns turns on the secondary
 * @returns the secondary-to-primary impedance ratio; NaN for turns that are not positive
 */
export function impedanceRatioFromTurns(primaryTurns: number, secondaryTurns: number): number {
  if (!(primaryTurns > 0) || !(secondaryTurns > 0) || !Number.isFinite(primaryTurns) || !Number.isFinite(secondaryTurns)) return NaN;
  return (secondaryTurns / primaryTurns) ** 2;
}
