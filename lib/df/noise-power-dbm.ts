/**
 * Noise power a lossless antenna delivers in a bandwidth for a noise figure Fam:
 * Pn = Fam - 174 + 10 log10(B) dBm (-174 dBm/Hz is kT0 at 290 K; ITU-R P.372).
 * @param famDb external noise figure in dB
 * @param bandwidthHz receiver bandwidth in hertz
 * @returns power in dBm; NaN for invalid input
 */
export function noisePowerDbm(famDb: number, bandwidthHz: number): number {
  if (!Number.isFinite(famDb) || !Number.isFinite(bandwidthHz) || bandwidthHz <= 0) return NaN;
  return famDb - 174 + 10 * Math.log10(bandwidthHz);
}
