import { calculateMagVarForDecimalYear, MODEL_EPOCH, MODEL_VALID_UNTIL } from 'magvar';
import { dateToDecimalYear } from './date-to-decimal-year';

/**
 * Runs fn with console.warn silenced: magvar prints its own validity notice once per process,
 * and this library returns that notice as a value instead (no output from pure math).
 */
function quietly<T>(fn: () => T): T {
  const warn = console.warn;
  console.warn = () => {};
  try {
    return fn();
  } finally {
    console.warn = warn;
  }
}

/**
 * Magnetic declination from the World Magnetic Model 2025 (NOAA NCEI / BGS), via the magvar
 * package (which rounds to 0.01 degree), with a plain-language warning when the date lies outside
 * the model's 2025.0-2030.0 validity window (the value is then an extrapolation) or an input is
 * unusable (declinationDeg is then NaN).
 * @param lat geodetic latitude, WGS84 degrees
 * @param lon longitude, degrees east
 * @param date the instant of the bearing
 * @param altitudeKm height above the WGS84 ellipsoid in kilometres, default 0
 * @returns declination in degrees, east positive (magnetic north east of true north)
 */
export function declinationInfo(lat: number, lon: number, date: Date, altitudeKm = 0): { declinationDeg: number; warning?: string } {
  const year = dateToDecimalYear(date);
  if (![lat, lon, altitudeKm, year].every(Number.isFinite) || Math.abs(lat) > 90) {
    return { declinationDeg: NaN, warning: 'Declination needs a valid date, a latitude from -90 to 90 and a finite longitude and height.' };
  }
  const outside = year < MODEL_EPOCH || year >= MODEL_VALID_UNTIL;
  const declinationDeg = outside ? quietly(() => calculateMagVarForDecimalYear(year, lat, lon, altitudeKm)) : calculateMagVarForDecimalYear(year, lat, lon, altitudeKm);
  if (outside) {
    return {
      declinationDeg,
      warning: `The World Magnetic Model 2025 is valid from ${MODEL_EPOCH} to ${MODEL_VALID_UNTIL}; for ${year.toFixed(2)} the declination is extrapolated and may be off by a degree or more.`,
    };
  }
  return { declinationDeg };
}
