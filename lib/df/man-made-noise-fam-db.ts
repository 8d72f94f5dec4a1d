/** Noise environments of Recommendation ITU-R P.372 (man-made noise categories and galactic noise). */
export type NoiseEnvironment = 'city' | 'residential' | 'rural' | 'quiet-rural' | 'galactic';

/**
 * Constants c and d of Fam = c - d log10(f_MHz), Recommendation ITU-R P.372, Table 1
 * (man-made noise, median values) and galactic noise.
 */
export const ITU_P372_NOISE: Record<NoiseEnvironment, { c: number; d: number }> = {
  city: { c: 76.8, d: 27.7 },
  residential: { c: 72.5, d: 27.7 },
  rural: { c: 67.2, d: 27.7 },
  'quiet-rural': { c: 53.6, d: 28.6 },
  galactic: { c: 52.0, d: 23.0 },
};

/**
 * Expected median external noise figure Fam (ITU-R P.372): Fam = c - d log10(f in MHz).
 * @param environment noise environment
 * @param frequencyHz frequency in hertz
 * @returns Fam in dB above kT0b; NaN for unknown environment or invalid frequency
 */
export function manMadeNoiseFamDb(environment: NoiseEnvironment, frequencyHz: number): number {
  const k = ITU_P372_NOISE[environment];
  if (!k || !Number.isFinite(frequencyHz) || frequencyHz <= 0) return NaN;
  return k.c - k.d * Math.log10(frequencyHz / 1e6);
}
