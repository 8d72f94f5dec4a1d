import { manMadeNoiseFamDb, type NoiseEnvironment } from './man-made-noise-fam-db';
import { noisePowerDbm } from './noise-power-dbm';

/**
 * How far a measured level stands above the expected man-made noise (ITU-R P.372) for the
 * environment, frequency and bandwidth (lossless antenna assumed).
 * @param levelDbm measured level in dBm
 * @param environment noise environment
 * @param frequencyHz frequency in hertz
 * @param bandwidthHz receiver bandwidth in hertz
 * @returns excess in dB (negative: below the expected noise); NaN for invalid input
 */
export function excessOverNoiseDb(levelDbm: number, environment: NoiseEnvironment, frequencyHz: number, bandwidthHz: number): number {
  return levelDbm - noisePowerDbm(manMadeNoiseFamDb(environment, frequencyHz), bandwidthHz);
}
