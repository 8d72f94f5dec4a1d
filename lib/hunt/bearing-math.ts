/**
 * The pure part of storing a bearing, shared by the server (lib/hunt/bearings.ts) and the phone
 * (the offline fix from queued lines): its 1-sigma and its true azimuth. No db, no next/*.
 */
import { declinationInfo, magneticToTrue, normalizeDeg360, NULL_SIGMA_PRESETS_DEG, nullWidthToSigmaDeg, type LineOfBearing, type NextSpotOptions } from '@/lib/df';

type SigmaInput = { sigmaDeg?: number; nullWidthDeg?: number; quality?: 'sharp' | 'fair' | 'broad' };

export const round = (x: number, places = 6) => Math.round(x * 10 ** places) / 10 ** places;

/** 1-sigma in degrees: stated, else half the measured null width, else the sharp/fair/broad preset (default fair). */
export function resolveSigmaDeg(i: SigmaInput): number {
  if (i.sigmaDeg !== undefined) return i.sigmaDeg;
  if (i.nullWidthDeg !== undefined) return nullWidthToSigmaDeg(i.nullWidthDeg);
  return NULL_SIGMA_PRESETS_DEG[i.quality ?? 'fair'];
}

/**
 * True azimuth from an entered one: a magnetic bearing goes through lib/df's magneticToTrue (the
 * WMM2025 declination for the place and date), with the model's validity warning when the date is
 * outside it; fixView repeats that warning for every magnetic line it applies to.
 */
export function trueAzimuth(enteredDeg: number, reference: 'true' | 'magnetic', lat: number, lon: number, when: Date) {
  if (reference === 'true') return { declinationDeg: 0, azimuthTrueDeg: normalizeDeg360(enteredDeg) };
  const { declinationDeg, warning } = declinationInfo(lat, lon, when);
  return { declinationDeg: round(declinationDeg, 3), azimuthTrueDeg: round(magneticToTrue(enteredDeg, lat, lon, when)), ...(warning ? { warning } : {}) };
}

/** The lines lib/df works on: active bearings, true azimuths, ids = bearing ids. */
export function toLines(bearings: { id: string; lat: number; lon: number; azimuthTrueDeg: number; sigmaDeg: number; oneWay: boolean; excluded: boolean }[]): LineOfBearing[] {
  return bearings
    .filter((b) => !b.excluded)
    .map((b) => ({ id: b.id, lat: b.lat, lon: b.lon, azimuthDeg: b.azimuthTrueDeg, sigmaDeg: b.sigmaDeg, oneWay: b.oneWay }));
}

/**
 * What suggestNextSpots knows about the hunt: the bearings' frequency (median of the active lines
 * that have one; keeps spots out of the near field) and where the hunter last stood (the latest
 * active bearing), so spots within a walk are preferred.
 */
export function nextSpotOptions(bearings: { lat: number; lon: number; excluded: boolean; frequencyKhz: number | null; takenAt: Date | string }[]): NextSpotOptions {
  const active = bearings.filter((b) => !b.excluded);
  const khz = active.map((b) => b.frequencyKhz).filter((f): f is number => typeof f === 'number' && f > 0).sort((a, b) => a - b);
  const latest = active.reduce<(typeof active)[number] | undefined>((a, b) => (!a || new Date(b.takenAt) > new Date(a.takenAt) ? b : a), undefined);
  return {
    count: 3,
    ...(khz.length ? { frequencyHz: khz[khz.length >> 1] * 1000 } : {}),
    ...(latest ? { from: { lat: latest.lat, lon: latest.lon } } : {}),
  };
}
