import { describe, expect, it } from 'vitest';
import { fitNullSweep } from '@/lib/df';
import { gaussian, mulberry32 } from './support/scene';

// Small-loop response: figure-eight pattern, power ~ sin^2 of the angle between the loop axis and
// the direction to the source, two nulls 180 degrees apart (common practice, no source), plus a
// floor B that fills the null.
function sweep(nullDeg: number, depthDb: number, azimuths: number[], noise?: () => number) {
  const b = 1 / (Math.pow(10, depthDb / 10) - 1); // A = 1: depth = 10 log10((A + B) / B)
  return azimuths.map((az) => {
    const s = Math.sin(((az - nullDeg) * Math.PI) / 180);
    return { azimuthDeg: az, levelDbm: -70 + 10 * Math.log10(s * s + b) + (noise ? noise() : 0) };
  });
}
const every10 = Array.from({ length: 36 }, (_, i) => i * 10);
const angleDiff = (a: number, b: number) => Math.abs((((a - b) % 180) + 270) % 180 - 90);

describe('fitNullSweep', () => {
  for (const nullDeg of [0, 37.3, 91.5, 143.8, 179.6]) {
    for (const depth of [20, 30, 50]) {
      it(`noise-free 36-point sweep: null ${nullDeg}, depth ${depth} dB`, () => {
        const fit = fitNullSweep(sweep(nullDeg, depth, every10));
        expect(fit.ok).toBe(true);
        if (!fit.ok) return;
        expect(angleDiff(fit.nullAzimuthDeg, nullDeg)).toBeLessThan(0.2);
        expect(fit.nullAzimuthDeg).toBeGreaterThanOrEqual(0);
        expect(fit.nullAzimuthDeg).toBeLessThan(180);
        expect(Math.abs(fit.nullDepthDb - depth)).toBeLessThan(1);
      });
    }
  }

  it('a sparse sweep of 7 readings around the null (+-30 degrees, 10-degree steps), in any azimuth range', () => {
    const az = [-30, -20, -10, 0, 10, 20, 30].map((d) => 400 + 212 + d); // around 612 = 252 = null 72 (mod 180)
    const fit = fitNullSweep(sweep(252, 35, az));
    expect(fit.ok && angleDiff(fit.nullAzimuthDeg, 72)).toBeLessThan(0.2);
  });

  it('noisy readings: null close, depth never beyond what the readings span, sigma honest-ish', () => {
    const noise = gaussian(mulberry32(7));
    for (let t = 0; t < 20; t++) {
      const samples = sweep(64, 45, every10, () => noise() * 1.5);
      const fit = fitNullSweep(samples);
      expect(fit.ok).toBe(true);
      if (!fit.ok) continue;
      const levels = samples.map((s) => s.levelDbm);
      expect(fit.nullDepthDb).toBeLessThanOrEqual(Math.max(...levels) - Math.min(...levels) + 1.0001);
      expect(angleDiff(fit.nullAzimuthDeg, 64)).toBeLessThan(Math.max(4 * fit.sigmaDeg, 2));
      expect(fit.sigmaDeg).toBeGreaterThanOrEqual(0.5);
      expect(fit.rmsResidualDb).toBeGreaterThan(0.5);
    }
  });

  it('refuses what cannot give a null', () => {
    expect(fitNullSweep(sweep(10, 30, [0, 10, 20]))).toMatchObject({ ok: false });
    expect(fitNullSweep([...sweep(10, 30, [0, 10, 20]), { azimuthDeg: NaN, levelDbm: -80 }])).toMatchObject({ ok: false });
    expect(fitNullSweep(every10.map((a) => ({ azimuthDeg: a, levelDbm: -90 })))).toMatchObject({ ok: false, reason: 'no-null' });
    // all readings at one loop angle (and its reverse)
    expect(fitNullSweep([0, 180, 360, 0, 180].map((a, i) => ({ azimuthDeg: a, levelDbm: -90 + i })))).toMatchObject({ ok: false, reason: 'unconstrained' });
  });
});
