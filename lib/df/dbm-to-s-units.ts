import { DB_PER_S_UNIT, s9Dbm } from './s-units-to-dbm';

/**
 * Label of a level `over` dB relative to S9: rounded to the whole decibel first, then the S-unit
 * reached (6 dB each) with the decibels above it: -73 dBm at HF is "S9", -76 dBm "S8+3 dB",
 * -79 dBm "S8", -60 dBm "S9+13 dB"; below S0 "S0".
 */
function sLabel(over: number): string {
  const db = Math.round(over) || 0;
  if (db >= 0) return db === 0 ? 'S9' : `S9+${db} dB`;
  const unit = 9 - Math.ceil(-db / DB_PER_S_UNIT);
  if (unit < 0) return 'S0';
  const rest = db + DB_PER_S_UNIT * (9 - unit);
  return rest === 0 ? `S${unit}` : `S${unit}+${rest} dB`;
}

/**
 * Converts a level to an S-meter reading (IARU Region 1 convention, see sUnitsToDbm).
 * @param levelDbm level at the receiver input, dBm
 * @param frequencyHz frequency in hertz
 * @returns sUnits (fractional, at most 9, may be below 0 for very weak levels), overS9Db (>= 0)
 *   and a label such as "S7", "S8+3 dB" or "S9+12 dB"; NaN values and label "?" for non-finite input
 */
export function dbmToSUnits(levelDbm: number, frequencyHz: number): { sUnits: number; overS9Db: number; label: string } {
  if (!Number.isFinite(levelDbm) || !Number.isFinite(frequencyHz)) return { sUnits: NaN, overS9Db: NaN, label: '?' };
  const over = levelDbm - s9Dbm(frequencyHz);
  const sUnits = over > 0 ? 9 : 9 + over / DB_PER_S_UNIT;
  return { sUnits, overS9Db: Math.max(over, 0), label: sLabel(over) };
}
