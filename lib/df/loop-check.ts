import { SPEED_OF_LIGHT_M_S, wavelengthM } from './wavelength-m';

/** A loop counts as "small" (figure-eight pattern, deep nulls) up to this circumference in wavelengths. Common practice. */
export const SMALL_LOOP_MAX_WAVELENGTHS = 0.1;

/**
 * Electrical size of a receiving loop.
 * @param circumferenceM loop circumference in metres
 * @param frequencyHz frequency in hertz
 * @returns circumferenceWavelengths (circumference / lambda), isSmall (<= 0.1 lambda) and
 *   maxSmallFrequencyHz, the highest frequency in hertz at which the loop is still small
 */
export function loopCheck(circumferenceM: number, frequencyHz: number): { circumferenceWavelengths: number; isSmall: boolean; maxSmallFrequencyHz: number } {
  const valid = Number.isFinite(circumferenceM) && circumferenceM > 0;
  const ratio = valid ? circumferenceM / wavelengthM(frequencyHz) : NaN;
  return {
    circumferenceWavelengths: ratio,
    isSmall: ratio <= SMALL_LOOP_MAX_WAVELENGTHS,
    maxSmallFrequencyHz: valid ? (SMALL_LOOP_MAX_WAVELENGTHS * SPEED_OF_LIGHT_M_S) / circumferenceM : NaN,
  };
}
