import { describe, expect, it } from 'vitest';
import { Geodesic } from 'geographiclib-geodesic';
import { trailPeak, type TrailReading } from '@/lib/df';
import { distanceM, gaussian, mulberry32 } from './support/scene';

/**
 * A generated walk: a source at a known point (invented, open land), a straight street passing
 * `offsetM` from it, readings every `stepM` metres. Level model: inside the near field of an
 * electrically small source the magnetic field falls as 1/r³ (60 dB per decade of distance; small
 * loop fields, Balanis "Antenna Theory" ch. 5 — recalled from memory), plus Gaussian reading noise
 * (3 dB: common practice, no source) and phone position jitter (GeographicLib Direct as the truth).
 */
const SOURCE = { lat: -31.0512, lon: 129.7433 };

function walk(seed: number, o: { offsetM?: number; lengthM?: number; stepM?: number; noiseDb?: number; jitterM?: number; streetAzDeg?: number } = {}) {
  const { offsetM = 15, lengthM = 240, stepM = 4, noiseDb = 3, jitterM = 4, streetAzDeg = 70 } = o;
  const rand = mulberry32(seed);
  const g = gaussian(rand);
  // The street's point nearest the source: offsetM at right angles to the street.
  const foot = Geodesic.WGS84.Direct(SOURCE.lat, SOURCE.lon, streetAzDeg + 90, offsetM);
  const start = Geodesic.WGS84.Direct(foot.lat2 as number, foot.lon2 as number, streetAzDeg + 180, lengthM / 2);
  const readings: TrailReading[] = [];
  for (let s = 0; s <= lengthM; s += stepM) {
    const p = Geodesic.WGS84.Direct(start.lat2 as number, start.lon2 as number, streetAzDeg, s);
    const trueP = { lat: p.lat2 as number, lon: p.lon2 as number };
    const r = Math.max(distanceM(trueP, SOURCE), 1);
    const level = -40 - 60 * Math.log10(r / 10) + noiseDb * g();
    const shown = Geodesic.WGS84.Direct(trueP.lat, trueP.lon, 360 * rand(), Math.abs(jitterM * g()));
    readings.push({ lat: shown.lat2 as number, lon: shown.lon2 as number, levelDbm: level });
  }
  return { readings, foot: { lat: foot.lat2 as number, lon: foot.lon2 as number } };
}

describe('trailPeak on a generated walk past a known source', () => {
  it('finds the street point nearest the source within 12 m, over 200 seeded walks', () => {
    const misses: number[] = [];
    for (let seed = 1; seed <= 200; seed++) {
      const { readings, foot } = walk(seed);
      const peak = trailPeak(readings)!;
      misses.push(distanceM(peak, foot));
    }
    misses.sort((a, b) => a - b);
    expect(misses[Math.floor(misses.length * 0.95)]).toBeLessThan(12);
  });

  it('is steadier than the single loudest reading (median miss smaller)', () => {
    const smooth: number[] = [];
    const single: number[] = [];
    for (let seed = 1; seed <= 200; seed++) {
      const { readings, foot } = walk(seed, { noiseDb: 5, stepM: 3 });
      smooth.push(distanceM(trailPeak(readings)!, foot));
      const loudest = readings.reduce((b, r) => (r.levelDbm > b.levelDbm ? r : b));
      single.push(distanceM(loudest, foot));
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    expect(median(smooth)).toBeLessThan(median(single));
  });

  it('one spike far from the source does not take the peak', () => {
    const { readings, foot } = walk(7, { noiseDb: 0, jitterM: 0 });
    readings[2] = { ...readings[2], levelDbm: -20 }; // a passing car, 100 m up the street, louder than any real reading
    const peak = trailPeak(readings)!;
    expect(distanceM(peak, foot)).toBeLessThan(6);
  });

  it('walking the street the other way gives the same peak (order invariance up to direction)', () => {
    const { readings } = walk(11);
    const a = trailPeak(readings)!;
    const b = trailPeak([...readings].reverse())!;
    expect(distanceM(a, b)).toBeLessThan(1e-6);
    expect(b.index).toBe(readings.length - 1 - a.index);
  });

  it('empty and broken input', () => {
    expect(trailPeak([])).toBeNull();
    expect(trailPeak([{ lat: NaN, lon: 0, levelDbm: -50 }])).toBeNull();
    const p = trailPeak([
      { lat: -31.05, lon: 129.74, levelDbm: -60 },
      { lat: NaN, lon: 129.74, levelDbm: 0 },
    ])!;
    expect(p.index).toBe(0);
    expect(p.smoothedDbm[1]).toBeNaN();
    expect(() => trailPeak([], { smoothingM: 0 })).toThrow(RangeError);
  });

  it('a single reading is its own peak; smoothing averages decibels', () => {
    const one = trailPeak([{ lat: -31.05, lon: 129.74, levelDbm: -70 }])!;
    expect(one.levelDbm).toBeCloseTo(-70, 10);
    // Two readings at the same spot, -60 and -70 dBm, equal weights: -65 dBm (by hand).
    const two = trailPeak([
      { lat: -31.05, lon: 129.74, levelDbm: -60 },
      { lat: -31.05, lon: 129.74, levelDbm: -70 },
    ])!;
    expect(two.levelDbm).toBeCloseTo(-65, 10);
  });
});
