import { DB_PER_S_UNIT, s9Dbm } from './s-units-to-dbm';

/**
 * Converts a level to an S-meter reading (IARU Region 1 convention, see sUnitsToDbm).
 * @param levelDbm level at the receiver input, dBm
 * @param frequencyHz frequency in hertz
 * @returns sUnits (fractional, at most 9, may be below 0 for very weak levels), overS9Db (>= 0)
 *   and a label such as "S7" or "S9+12 dB"; NaN values and label "?" for non-finite input
 */
export function dbmToSUnits(levelDbm: number, frequencyHz: number): { sUnits: number; overS9Db: number; label: string } {
  if (!Number.isFinite(levelDbm) || !Number.isFinite(frequencyHz)) return { sUnits: NaN, overS9Db: NaN, label: '?' };
  const over = levelDbm - s9Dbm(frequencyHz);
  if (over > 0) return { sUnits: 9, overS9Db: over, label: `S9+${Math.round(over)} dB` };
  const sUnits = 9 + over / DB_PER_S_UNIT;
  return { sUnits, overS9Db: 0, label: `S${Math.max(0, Math.round(sUnits))}` };
}
