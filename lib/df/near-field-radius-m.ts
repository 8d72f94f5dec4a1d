import { wavelengthM } from './wavelength-m';

/**
 * Radius of the reactive near field of a small source, lambda / (2 pi). Closer than this the
 * field is not a plane wave and loop nulls need not point at the source.
 * @param frequencyHz frequency in hertz
 * @returns radius in metres (NaN for an invalid frequency)
 */
export function nearFieldRadiusM(frequencyHz: number): number {
  return wavelengthM(frequencyHz) / (2 * Math.PI);
}
