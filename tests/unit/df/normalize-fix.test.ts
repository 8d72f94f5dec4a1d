import { describe, expect, it } from 'vitest';
import { estimateFix, normalizeFix, type Fix } from '@/lib/df';
import { sceneLines } from './support/scene';

// Old fix_snapshots JSON (written before the robust fix) must still render.
describe('normalizeFix', () => {
  it('an old snapshot with withoutOutliers: the robust one becomes the main fix, the old main the all-lines alternative', () => {
    const ellipse = { semiMajorM: 120, semiMinorM: 40, majorAxisAzimuthDeg: 30, confidence: 0.95 };
    const robust = { lat: 10.001, lon: 20.001, ellipse: { ...ellipse, semiMajorM: 60 } };
    const old = { ok: true, lat: 10, lon: 20, ellipse, residuals: [], outlierIds: ['b2'], withoutOutliers: robust, intersections: [], warnings: ['The lines disagree.'] };
    const fix = normalizeFix(old as unknown as Fix);
    expect(fix).toMatchObject({ ok: true, lat: 10.001, lon: 20.001, ellipse: robust.ellipse, allLines: { lat: 10, lon: 20, ellipse }, varianceFactor: 1 });
    if (fix.ok) {
      expect(fix.notices).toEqual([{ code: 'note', message: 'The lines disagree.' }]);
      expect('withoutOutliers' in fix).toBe(false);
    }
  });

  it('a current fix and a refusal pass unchanged', () => {
    const lines = sceneLines({ lat: 40, lon: -30 }, [{ fromSourceAzDeg: 0, rangeM: 500 }, { fromSourceAzDeg: 90, rangeM: 600 }]);
    const fix = JSON.parse(JSON.stringify(estimateFix(lines)));
    expect(normalizeFix(fix)).toEqual(fix);
    expect(normalizeFix({ ok: false, reason: 'too-few-lines', message: 'x' })).toEqual({ ok: false, reason: 'too-few-lines', message: 'x' });
  });
});
