import { describe, expect, it } from 'vitest';
import { formatGridLabel, gridSpacingDeg, gridValues, lonSpanAtZoomDeg } from '@/components/map/grid-lines';

describe('coordinate grid of the tiles-off map', () => {
  it('picks a 1-2-5 step giving at most six lines (common practice, no source)', () => {
    expect(gridSpacingDeg(0.05)).toBe(0.01);
    expect(gridSpacingDeg(0.006)).toBe(0.001);
    expect(gridSpacingDeg(1)).toBe(0.2);
    expect(gridSpacingDeg(170)).toBe(30);
    expect(gridSpacingDeg(0)).toBeNaN();
  });

  it('follows the zoom: each zoom step in halves the span and never widens the step', () => {
    // Web Mercator with 256-pixel tiles: 360 degrees over 256 * 2^zoom pixels (the tiling scheme Leaflet uses).
    expect(lonSpanAtZoomDeg(0, 256)).toBe(360);
    expect(lonSpanAtZoomDeg(10, 360)).toBeCloseTo(0.494, 3);
    let last = Infinity;
    for (let z = 2; z <= 19; z++) {
      const step = gridSpacingDeg(lonSpanAtZoomDeg(z, 360));
      expect(step).toBeLessThanOrEqual(last);
      expect(lonSpanAtZoomDeg(z, 360) / step).toBeLessThanOrEqual(6);
      last = step;
    }
  });

  it('lists the multiples inside the view and labels them with hemisphere', () => {
    expect(gridValues(51.1234, 51.1612, 0.01)).toEqual([51.13, 51.14, 51.15, 51.16]);
    expect(gridValues(-0.021, 0.012, 0.01)).toEqual([-0.02, -0.01, 0, 0.01]);
    expect(formatGridLabel(51.13, 0.01, 'lat')).toBe('51.13° N');
    expect(formatGridLabel(-0.005, 0.005, 'lon')).toBe('0.005° W');
    expect(formatGridLabel(0, 0.01, 'lon')).toBe('0.00°');
    expect(formatGridLabel(190, 10, 'lon')).toBe('170° W');
  });
});
