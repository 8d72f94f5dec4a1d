/**
 * Typical 1-sigma bearing errors in degrees for a null judged sharp, fair or broad.
 * Common practice, no source.
 */
export const NULL_SIGMA_PRESETS_DEG = { sharp: 2, fair: 4, broad: 8 } as const;

/**
 * 1-sigma bearing error from the width of a null: half the arc over which the level stays
 * within a few dB of the null is taken as a fair 1-sigma (common practice, no source).
 * @param widthDeg full width of the null in degrees
 * @returns sigma in degrees (at least 0.5); NaN for a width that is not positive and finite
 */
export function nullWidthToSigmaDeg(widthDeg: number): number {
  if (!Number.isFinite(widthDeg) || widthDeg <= 0) return NaN;
  return Math.max(widthDeg / 2, 0.5);
}
