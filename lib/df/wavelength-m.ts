/** Speed of light in vacuum, metres per second (SI, exact). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;

/**
 * Free-space wavelength.
 * @param frequencyHz frequency in hertz (> 0)
 * @returns wavelength in metres; NaN for a frequency that is not positive and finite
 */
export function wavelengthM(frequencyHz: number): number {
  return Number.isFinite(frequencyHz) && frequencyHz > 0 ? SPEED_OF_LIGHT_M_S / frequencyHz : NaN;
}
