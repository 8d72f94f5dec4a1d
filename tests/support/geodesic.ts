/**
 * GeographicLib's Direct/Inverse on WGS84 (Karney 2013): the reference library itself, not
 * lib/df's internals, for browser tests that build scenes and check fixes against the truth.
 */
import geographiclib from 'geographiclib-geodesic';

const WGS84 = geographiclib.Geodesic.WGS84;

export const geodesicDirect = (lat: number, lon: number, azi: number, s: number) => {
  const r = WGS84.Direct(lat, lon, azi, s);
  return { lat: r.lat2!, lon: r.lon2! };
};

export const geodesicInverse = (lat1: number, lon1: number, lat2: number, lon2: number) => {
  const r = WGS84.Inverse(lat1, lon1, lat2, lon2);
  return { azi1: r.azi1!, s12: r.s12! };
};
