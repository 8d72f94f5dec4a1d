import { manMadeNoiseInfo, noisePowerDbm, sUnitsToDbm, type NoiseEnvironment } from '@/lib/df';
import type { LevelRow } from '@/db/levels';

/**
 * The level log's figures. Each reading is shown against the expected man-made noise power for
 * its frequency and bandwidth in the club's environment (Rec. ITU-R P.372: Fam = c − d log f,
 * Pn = Fam − 174 + 10 log B dBm, through lib/df), and before/after readings on one frequency
 * give the fix's improvement. Pure.
 */
export type LevelView = {
  id: string;
  clientId: string | null;
  frequencyKhz: number;
  level: { unit: 'S' | 'dBm'; value: number; overS9Db?: number };
  bandwidthHz: number;
  takenAt: string;
  lat: number | null;
  lon: number | null;
  phase: 'before' | 'after';
  levelDbm: number;
  expectedDbm: number;
  excessDb: number;
  warning?: string;
};

const round1 = (x: number) => Math.round(x * 10) / 10;

/** A reading in dBm: S-units by the IARU Region 1 convention (lib/df), dBm as given. */
export function levelToDbm(level: { unit: 'S' | 'dBm'; value: number; overS9Db?: number }, frequencyKhz: number): number {
  return level.unit === 'dBm' ? level.value : sUnitsToDbm(level.value, level.overS9Db ?? 0, frequencyKhz * 1000);
}

/** Expected man-made noise power, dBm, at this frequency and bandwidth in the environment. */
export function expectedNoise(environment: NoiseEnvironment, frequencyKhz: number, bandwidthHz: number): { dbm: number; warning?: string } {
  const info = manMadeNoiseInfo(environment, frequencyKhz * 1000);
  return { dbm: noisePowerDbm(info.famDb, bandwidthHz), warning: info.warning };
}

/** A reading against the expected floor: level, expected and excess, dBm / dB to 0.1 dB (the log's and the CSV's figures). */
export function excessOverFloor(environment: NoiseEnvironment, frequencyKhz: number, bandwidthHz: number, levelDbm: number) {
  const e = expectedNoise(environment, frequencyKhz, bandwidthHz);
  return { levelDbm: round1(levelDbm), expectedDbm: round1(e.dbm), excessDb: round1(levelDbm - e.dbm), warning: e.warning };
}

export function toLevelView(r: LevelRow, environment: NoiseEnvironment): LevelView {
  const e = excessOverFloor(environment, r.frequencyKhz, r.bandwidthHz, r.levelDbm);
  return {
    id: r.id,
    clientId: r.clientId,
    frequencyKhz: r.frequencyKhz,
    level: r.levelUnit === 'S' ? { unit: 'S', value: r.levelValue, overS9Db: r.overS9Db } : { unit: 'dBm', value: r.levelValue },
    bandwidthHz: r.bandwidthHz,
    takenAt: new Date(r.takenAt).toISOString(),
    lat: r.lat,
    lon: r.lon,
    phase: r.phase,
    levelDbm: e.levelDbm,
    expectedDbm: e.expectedDbm,
    excessDb: e.excessDb,
    ...(e.warning ? { warning: e.warning } : {}),
  };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

export type BeforeAfter = { frequencyKhz: number; beforeDbm: number; afterDbm: number; differenceDb: number; readings: number };

/**
 * Before and after on the frequency with readings in both phases (the one with most readings):
 * the median of each phase and their difference (negative: quieter after the fix).
 */
export function beforeAfter(levels: Pick<LevelRow, 'frequencyKhz' | 'levelDbm' | 'phase'>[]): BeforeAfter | null {
  const byFreq = new Map<number, { before: number[]; after: number[] }>();
  for (const l of levels) {
    const b = byFreq.get(l.frequencyKhz) ?? { before: [], after: [] };
    b[l.phase].push(l.levelDbm);
    byFreq.set(l.frequencyKhz, b);
  }
  let best: BeforeAfter | null = null;
  for (const [frequencyKhz, b] of byFreq) {
    if (!b.before.length || !b.after.length) continue;
    const n = b.before.length + b.after.length;
    if (best && best.readings >= n) continue;
    const beforeDbm = round1(median(b.before));
    const afterDbm = round1(median(b.after));
    best = { frequencyKhz, beforeDbm, afterDbm, differenceDb: round1(afterDbm - beforeDbm), readings: n };
  }
  return best;
}
