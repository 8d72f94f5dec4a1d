import { describe, expect, it } from 'vitest';
import { fitNullSweep } from '@/lib/df';
import { polarPoint, polarScaleDb, sweepAmplitudesMw, sweepModelCurve, sweepModelDbm } from '@/components/hunt/sweep-model';
import { aroundRoughNull, everyTenDegrees } from '@/components/hunt/sweep-presets';

// Model: the small-loop figure-eight P = A sin^2(theta - theta0) + B, as fitted by lib/df fitNullSweep.
describe('sweep plot model', () => {
  it('puts the strongest reading at the lobes and the null depth below it', () => {
    const amp = sweepAmplitudesMw(-70, 25);
    expect(sweepModelDbm(40, 40, amp)).toBeCloseTo(-95, 9);
    expect(sweepModelDbm(130, 40, amp)).toBeCloseTo(-70, 9);
    expect(sweepModelDbm(220, 40, amp)).toBeCloseTo(-95, 9); // the other end of the null line
  });

  it('is symmetric about the null and closes the curve', () => {
    const curve = sweepModelCurve(30, -60, 20, 5);
    expect(curve[0][0]).toBe(0);
    expect(curve[curve.length - 1][0]).toBeCloseTo(360, 9);
    const amp = sweepAmplitudesMw(-60, 20);
    for (const d of [5, 17, 60]) expect(sweepModelDbm(30 + d, 30, amp)).toBeCloseTo(sweepModelDbm(30 - d, 30, amp), 9);
  });

  it('redraws readings that follow the model exactly', () => {
    const amp = sweepAmplitudesMw(-65, 30);
    const samples = everyTenDegrees().map((az) => ({ azimuthDeg: az, levelDbm: sweepModelDbm(az, 72, amp) }));
    const fit = fitNullSweep(samples);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.nullAzimuthDeg).toBeCloseTo(72, 3);
    const max = Math.max(...samples.map((s) => s.levelDbm));
    const redrawn = sweepAmplitudesMw(max, fit.nullDepthDb);
    for (const s of samples) expect(sweepModelDbm(s.azimuthDeg, fit.nullAzimuthDeg, redrawn)).toBeCloseTo(s.levelDbm, 1);
  });

  it('scales the polar plot in 10 dB rings and uses compass directions', () => {
    expect(polarScaleDb([-71, -96])).toEqual({ topDbm: -70, rangeDb: 30 });
    const scale = { topDbm: -70, rangeDb: 30 };
    const [x, y] = polarPoint(90, -70, scale, 100, 100, 50);
    expect(x).toBeCloseTo(150, 9);
    expect(y).toBeCloseTo(100, 9);
    const [x0, y0] = polarPoint(0, -85, scale, 100, 100, 50);
    expect(x0).toBeCloseTo(100, 9);
    expect(y0).toBeCloseTo(75, 9);
    expect(polarPoint(0, -150, scale, 100, 100, 50)).toEqual([100, 100]);
  });

  it('lays out quick sweeps (common practice, no source)', () => {
    expect(everyTenDegrees()).toHaveLength(18);
    expect(aroundRoughNull(10)).toEqual([340, 350, 0, 10, 20, 30, 40]);
  });
});
