import { DB_PER_S_UNIT } from '@/lib/df';

/** A level as a hunter says it: "S7", "S9+20", "-61.5 dBm" (S past 9 continues at 6 dB per unit, IARU Region 1). */
export function levelLabel(level: { unit: 'S' | 'dBm'; value: number }): string {
  if (level.unit === 'dBm') return `${level.value} dBm`;
  if (level.value <= 9) return `S${Math.round(level.value * 10) / 10}`;
  return `S9+${Math.round((level.value - 9) * DB_PER_S_UNIT)}`;
}

/** The quick buttons of the walk: S1…S9 and S9+10…S9+40 (as S values on the 6 dB scale). */
export const S_BUTTONS: number[] = [1, 2, 3, 4, 5, 6, 7, 8, 9, 9 + 10 / DB_PER_S_UNIT, 9 + 20 / DB_PER_S_UNIT, 9 + 30 / DB_PER_S_UNIT, 9 + 40 / DB_PER_S_UNIT];
