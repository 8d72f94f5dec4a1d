import type { LineOfBearing } from '../types';
import { DEG, normalizeDeg360 } from './angles';

/** Default 1-sigma bearing error in degrees when a line states none. */
export const DEFAULT_SIGMA_DEG = 3;

/** A validated line with its name (`id ?? String(index)`), normalised azimuth and weight. */
export type PreparedLine = {
  index: number;
  id?: string;
  name: string;
  lat: number;
  lon: number;
  azimuthDeg: number;
  sigmaDeg: number;
  /** 1 / sigma^2 with sigma in radians. */
  weight: number;
  oneWay: boolean;
};

/** Why a line cannot be used, in plain words; null when it is fine. */
export function lineProblem(line: unknown, index: number): string | null {
  if (typeof line !== 'object' || line === null) return `line ${index} is not a bearing`;
  const l = line as Record<string, unknown>;
  const name = typeof l.id === 'string' ? `line "${l.id}"` : `line ${index}`;
  const num = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  if (!num(l.lat) || Math.abs(l.lat as number) > 90) return `${name}: latitude must be a number from -90 to 90`;
  if (!num(l.lon)) return `${name}: longitude must be a finite number`;
  if (!num(l.azimuthDeg)) return `${name}: azimuth must be a finite number of degrees`;
  if (l.sigmaDeg !== undefined && (!num(l.sigmaDeg) || (l.sigmaDeg as number) <= 0 || (l.sigmaDeg as number) >= 90)) {
    return `${name}: sigma must be a number of degrees above 0 and below 90`;
  }
  if (l.oneWay !== undefined && typeof l.oneWay !== 'boolean') return `${name}: oneWay must be true or false`;
  if (l.id !== undefined && typeof l.id !== 'string') return `${name}: id must be text`;
  return null;
}

/** Prepares a line that passed {@link lineProblem}. */
export function prepareLine(line: LineOfBearing, index: number): PreparedLine {
  const sigmaDeg = line.sigmaDeg ?? DEFAULT_SIGMA_DEG;
  const sigmaRad = sigmaDeg * DEG;
  return {
    index,
    id: line.id,
    name: line.id ?? String(index),
    lat: line.lat,
    lon: line.lon,
    azimuthDeg: normalizeDeg360(line.azimuthDeg),
    sigmaDeg,
    weight: 1 / (sigmaRad * sigmaRad),
    oneWay: line.oneWay === true,
  };
}
