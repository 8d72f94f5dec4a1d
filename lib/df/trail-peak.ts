import { approxEastNorth, geodesicInverse, offsetEastNorth } from './internal/geodesy';

/** One level reading on a walked trail, in the order it was taken. */
export type TrailReading = {
  /** WGS84 degrees */
  lat: number;
  lon: number;
  /** level at the receiver input, dBm */
  levelDbm: number;
};

export type TrailPeakOptions = {
  /**
   * Width of the smoothing along the walked path, metres: each reading's level is averaged with
   * its neighbours with Gaussian weights of this standard deviation in path distance. Default 12 m
   * (about two house fronts; common practice, no source).
   */
  smoothingM?: number;
};

export type TrailPeak = {
  /** index of the reading at the smoothed maximum */
  index: number;
  /** where to confirm from: the kernel-weighted mean position around the maximum (steadies GPS jitter) */
  lat: number;
  lon: number;
  /** smoothed level at the maximum, dBm */
  levelDbm: number;
  /** the smoothed level of every reading, dBm, in input order */
  smoothedDbm: number[];
  /** path distance of every reading from the first, metres */
  pathM: number[];
};

/**
 * Where a walked level trail peaks: levels smoothed over neighbouring readings (a Gaussian kernel
 * in distance along the path), so one lucky reading does not name the house; the peak is the
 * smoothed maximum. Readings with a non-finite position or level are ignored (their smoothed
 * level is NaN). Returns null for an empty trail.
 */
export function trailPeak(readings: TrailReading[], options: TrailPeakOptions = {}): TrailPeak | null {
  const sigma = options.smoothingM ?? 12;
  if (!(sigma > 0)) throw new RangeError('smoothingM must be a positive number of metres.');
  const ok = readings.map((r) => [r.lat, r.lon, r.levelDbm].every(Number.isFinite));
  const pathM: number[] = [];
  let along = 0;
  let prev: TrailReading | null = null;
  for (let i = 0; i < readings.length; i++) {
    if (ok[i] && prev) along += geodesicInverse(prev.lat, prev.lon, readings[i].lat, readings[i].lon).s12;
    if (ok[i]) prev = readings[i];
    pathM.push(along);
  }
  const reach = 3 * sigma;
  const weightsAround = (i: number) => {
    const out: [number, number][] = [];
    for (let j = 0; j < readings.length; j++) {
      const d = Math.abs(pathM[j] - pathM[i]);
      if (ok[j] && d <= reach) out.push([j, Math.exp(-0.5 * (d / sigma) ** 2)]);
    }
    return out;
  };
  const smoothedDbm = readings.map((_, i) => {
    if (!ok[i]) return NaN;
    // Averaged in decibels, not in power: a single loud reading (a passing car, a burst) then
    // moves its neighbourhood by its share of the weight only, instead of dominating it.
    let w = 0;
    let sum = 0;
    for (const [j, wj] of weightsAround(i)) {
      w += wj;
      sum += wj * readings[j].levelDbm;
    }
    return sum / w;
  });
  let best = -1;
  for (let i = 0; i < readings.length; i++) if (ok[i] && (best < 0 || smoothedDbm[i] > smoothedDbm[best])) best = i;
  if (best < 0) return null;
  const origin = readings[best];
  let w = 0;
  let e = 0;
  let n = 0;
  for (const [j, wj] of weightsAround(best)) {
    const [ej, nj] = approxEastNorth(origin.lat, origin.lon, readings[j].lat, readings[j].lon);
    w += wj;
    e += wj * ej;
    n += wj * nj;
  }
  const at = offsetEastNorth(origin.lat, origin.lon, e / w, n / w);
  return { index: best, lat: at.lat, lon: at.lon, levelDbm: smoothedDbm[best], smoothedDbm, pathM };
}
