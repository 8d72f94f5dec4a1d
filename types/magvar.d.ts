/** Declarations for the parts of magvar 2.2 (World Magnetic Model 2025) used in lib/df. */
declare module 'magvar' {
  /** Declination in degrees (east positive, rounded to 0.01) for a decimal year; altitude in km. */
  export function calculateMagVarForDecimalYear(decimalYear: number, latitude: number, longitude: number, altitude?: number): number;
  export const MODEL_EPOCH: number;
  export const MODEL_VALID_UNTIL: number;
}
