/** IARU Region 1 S-meter: S9 level in dBm below 30 MHz (HF). */
export const S9_HF_DBM = -73;
/** IARU Region 1 S-meter: S9 level in dBm from 30 MHz up (VHF/UHF). */
export const S9_VHF_DBM = -93;
/** IARU Region 1 S-meter: decibels per S-unit. */
export const DB_PER_S_UNIT = 6;

/** S9 reference level in dBm for a frequency in hertz (IARU Region 1 Technical Recommendation R.1). */
export function s9Dbm(frequencyHz: number): number {
  return frequencyHz >= 30e6 ? S9_VHF_DBM : S9_HF_DBM;
}

/**
 * Converts an S-meter reading to a level at the receiver input (IARU Region 1 convention:
 * S9 = -73 dBm below 30 MHz, -93 dBm above, 6 dB per S-unit, S9+N dB above S9).
 * @param sUnits S-units (0..9, fractions allowed)
 * @param overS9Db decibels over S9 ("S9+20" is sUnits 9, overS9Db 20); default 0
 * @param frequencyHz frequency in hertz (selects the HF or VHF reference)
 * @returns level in dBm; NaN for non-finite input
 */
export function sUnitsToDbm(sUnits: number, overS9Db: number, frequencyHz: number): number {
  if (![sUnits, overS9Db, frequencyHz].every(Number.isFinite)) return NaN;
  return s9Dbm(frequencyHz) - DB_PER_S_UNIT * (9 - sUnits) + overS9Db;
}
