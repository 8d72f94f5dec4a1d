/**
 * The pure part of storing a bearing, shared by the server (lib/hunt/bearings.ts) and the phone
 * (the offline fix from queued lines): its 1-sigma and its true azimuth. No db, no next/*.
 */
import { declinationInfo, NULL_SIGMA_PRESETS_DEG, nullWidthToSigmaDeg, type LineOfBearing } from '@/lib/df';

type SigmaInput = { sigmaDeg?: number; nullWidthDeg?: number; quality?: 'sharp' | 'fair' | 'broad' };

export const norm360 = (deg: number) => ((deg % 360) + 360) % 360;
export const round = (x: number, places = 6) => Math.round(x * 10 ** places) / 10 ** places;

/** 1-sigma in degrees: stated, else half the measured null width, else the sharp/fair/broad preset (default fair). */
export function resolveSigmaDeg(i: SigmaInput): number {
  if (i.sigmaDeg !== undefined) return i.sigmaDeg;
  if (i.nullWidthDeg !== undefined) return nullWidthToSigmaDeg(i.nullWidthDeg);
  return NULL_SIGMA_PRESETS_DEG[i.quality ?? 'fair'];
}

/** True azimuth from an entered one: magnetic bearings get the WMM2025 declination for the place and date. */
export function trueAzimuth(enteredDeg: number, reference: 'true' | 'magnetic', lat: number, lon: number, when: Date) {
  if (reference === 'true') return { declinationDeg: 0, azimuthTrueDeg: norm360(enteredDeg) };
  const { declinationDeg } = declinationInfo(lat, lon, when);
  return { declinationDeg: round(declinationDeg, 3), azimuthTrueDeg: round(norm360(enteredDeg + declinationDeg)) };
}


/** The lines lib/df works on: active bearings, true azimuths, ids = bearing ids. */
export function toLines(bearings: { id: string; lat: number; lon: number; azimuthTrueDeg: number; sigmaDeg: number; oneWay: boolean; excluded: boolean }[]): LineOfBearing[] {
  return bearings
    .filter((b) => !b.excluded)
    .map((b) => ({ id: b.id, lat: b.lat, lon: b.lon, azimuthDeg: b.azimuthTrueDeg, sigmaDeg: b.sigmaDeg, oneWay: b.oneWay }));
}
