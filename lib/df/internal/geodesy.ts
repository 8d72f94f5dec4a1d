/**
 * Thin wrappers over GeographicLib geodesics on the WGS84 ellipsoid
 * (Karney 2013, "Algorithms for geodesics", J. Geodesy 87).
 */
import * as geographiclib from 'geographiclib-geodesic';

type GeographicLib = typeof geographiclib;
// The package is a CommonJS bundle: bundlers expose named exports, plain Node ESM only `default`.
const lib: GeographicLib = (geographiclib as GeographicLib & { default?: GeographicLib }).default?.Geodesic
  ? ((geographiclib as { default?: GeographicLib }).default as GeographicLib)
  : geographiclib;
/** GeographicLib's Geodesic namespace (constants and the WGS84 ellipsoid). */
export const Geodesic = lib.Geodesic;
const WGS84 = Geodesic.WGS84;
const INVERSE_MASK = Geodesic.AZIMUTH | Geodesic.DISTANCE;
const DIRECT_MASK = Geodesic.LATITUDE | Geodesic.LONGITUDE | Geodesic.AZIMUTH;

/** Geodesic from point 1 to point 2: distance in metres, azimuths in degrees. */
export type InverseResult = { s12: number; azi1: number; azi2: number };

export function geodesicInverse(lat1: number, lon1: number, lat2: number, lon2: number): InverseResult {
  const r = WGS84.Inverse(lat1, lon1, lat2, lon2, INVERSE_MASK);
  return { s12: r.s12 ?? NaN, azi1: r.azi1 ?? NaN, azi2: r.azi2 ?? NaN };
}

/** Point reached from (lat, lon) going distanceM metres at azimuthDeg; longitude in [-180, 180]. */
export function geodesicDirect(lat: number, lon: number, azimuthDeg: number, distanceM: number): { lat: number; lon: number; azi2: number } {
  const r = WGS84.Direct(lat, lon, azimuthDeg, distanceM, DIRECT_MASK);
  return { lat: r.lat2 ?? NaN, lon: r.lon2 ?? NaN, azi2: r.azi2 ?? NaN };
}

/** Position reached by an east/north displacement in metres (along the geodesic of that azimuth). */
export function offsetEastNorth(lat: number, lon: number, eastM: number, northM: number): { lat: number; lon: number } {
  const d = Math.hypot(eastM, northM);
  if (d === 0) return { lat, lon };
  const p = geodesicDirect(lat, lon, (Math.atan2(eastM, northM) * 180) / Math.PI, d);
  return { lat: p.lat, lon: p.lon };
}

/**
 * Rough east/north metres of a point around an origin from the ellipsoid's radii of curvature at
 * the origin (good to a fraction of a percent within tens of km; used only for start values).
 */
export function approxEastNorth(originLat: number, originLon: number, lat: number, lon: number): [number, number] {
  const a = 6378137;
  const e2 = 0.00669437999014; // WGS84 first eccentricity squared
  const phi = (originLat * Math.PI) / 180;
  const w = 1 - e2 * Math.sin(phi) ** 2;
  const prime = a / Math.sqrt(w); // prime vertical radius
  const meridian = (a * (1 - e2)) / (w * Math.sqrt(w));
  let dLon = (lon - originLon) % 360;
  if (dLon > 180) dLon -= 360;
  if (dLon < -180) dLon += 360;
  return [((dLon * Math.PI) / 180) * prime * Math.cos(phi), (((lat - originLat) * Math.PI) / 180) * meridian];
}

/** Points along a geodesic from (lat, lon) at azimuthDeg, at the given distances in metres; longitudes unrolled (continuous). */
export function geodesicPoints(lat: number, lon: number, azimuthDeg: number, distancesM: number[]): [number, number][] {
  const line = WGS84.DirectLine(lat, lon, azimuthDeg, 0, Geodesic.STANDARD | Geodesic.DISTANCE_IN | Geodesic.LONG_UNROLL);
  return distancesM.map((s) => {
    const p = line.Position(s, Geodesic.LATITUDE | Geodesic.LONGITUDE | Geodesic.LONG_UNROLL);
    return [p.lat2 ?? NaN, p.lon2 ?? NaN];
  });
}
