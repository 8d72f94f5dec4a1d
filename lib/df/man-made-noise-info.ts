import { manMadeNoiseFamDb, type NoiseEnvironment } from './man-made-noise-fam-db';

/**
 * Frequency range of the straight-line noise models of Recommendation ITU-R P.372 (Table 1 and the
 * figure it summarises), hertz: 0.3 MHz to 250 MHz (recalled from memory of the Recommendation).
 */
export const P372_MIN_HZ = 0.3e6;
export const P372_MAX_HZ = 250e6;
/** Below about this frequency galactic noise is screened by the ionosphere (recalled from P.372). */
export const GALACTIC_MIN_HZ = 10e6;

/**
 * Expected median noise figure Fam (ITU-R P.372) with a plain-language warning when the frequency
 * lies outside the range the model was fitted for (the value is then an extrapolation).
 * @param environment noise environment
 * @param frequencyHz frequency in hertz
 * @returns famDb in dB above kT0b (NaN for invalid input) and, when out of range, a warning
 */
export function manMadeNoiseInfo(environment: NoiseEnvironment, frequencyHz: number): { famDb: number; warning?: string } {
  const famDb = manMadeNoiseFamDb(environment, frequencyHz);
  if (!Number.isFinite(famDb)) return { famDb, warning: 'The noise model needs a known environment and a frequency above 0 Hz.' };
  const mhz = (frequencyHz / 1e6).toPrecision(3);
  if (frequencyHz < P372_MIN_HZ || frequencyHz > P372_MAX_HZ) {
    return { famDb, warning: `The ITU-R P.372 noise lines hold from 0.3 to 250 MHz; at ${mhz} MHz the value is an extrapolation.` };
  }
  if (environment === 'galactic' && frequencyHz < GALACTIC_MIN_HZ) {
    return { famDb, warning: `At ${mhz} MHz galactic noise is mostly screened by the ionosphere: the value is an upper bound at best.` };
  }
  return { famDb };
}
