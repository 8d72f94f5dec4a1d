import { normalizeDeg } from './number-text';

/**
 * How the azimuth as entered becomes the true azimuth that will be saved, in words:
 * "magnetic 212.0° + declination 4.3° E = true 216.3°" or "true 216.3° (no conversion)".
 * @param azimuthDeg azimuth as entered, degrees clockwise from the chosen north
 * @param reference which north the azimuth is measured from
 * @param declinationDeg magnetic declination, degrees, east positive (World Magnetic Model)
 * @returns the sentence, or undefined when a needed number is missing
 */
export function describeTrueAzimuth(azimuthDeg: number | undefined, reference: 'true' | 'magnetic', declinationDeg: number | undefined): string | undefined {
  if (azimuthDeg === undefined || !Number.isFinite(azimuthDeg)) return undefined;
  if (reference === 'true') return `true ${normalizeDeg(azimuthDeg).toFixed(1)}° (no conversion)`;
  if (declinationDeg === undefined || !Number.isFinite(declinationDeg)) return undefined;
  const side = declinationDeg >= 0 ? 'E' : 'W';
  const sign = declinationDeg >= 0 ? '+' : '−';
  const trueDeg = normalizeDeg(azimuthDeg + declinationDeg);
  return `magnetic ${normalizeDeg(azimuthDeg).toFixed(1)}° ${sign} declination ${Math.abs(declinationDeg).toFixed(1)}° ${side} = true ${trueDeg.toFixed(1)}°`;
}
