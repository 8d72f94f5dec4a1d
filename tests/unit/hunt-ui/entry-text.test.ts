import { describe, expect, it } from 'vitest';
import { describeTrueAzimuth } from '@/components/hunt/azimuth-text';
import { parseDecimal, parseLevel } from '@/components/hunt/number-text';
import { sUnitsToDbm } from '@/lib/df';
import { bearingDrawLengthM, formatApproxMetres } from '@/components/map/map-geometry';

describe('what the hunter types', () => {
  it('reads decimal commas and points, and tells empty from wrong', () => {
    expect(parseDecimal('212,5')).toBe(212.5);
    expect(parseDecimal(' 7.1 ')).toBe(7.1);
    expect(parseDecimal('')).toBeUndefined();
    expect(parseDecimal('12a')).toBeNaN();
  });

  it('reads S9+20 so that the IARU Region 1 scale gives S9 + 20 dB', () => {
    // IARU Region 1 Technical Recommendation R.1: S9 = -73 dBm below 30 MHz, 6 dB per S-unit.
    const s = parseLevel('9+20', 'S') as number;
    expect(sUnitsToDbm(s, 0, 7e6)).toBeCloseTo(-53, 9);
    expect(parseLevel('S7', 'S')).toBe(7);
    expect(parseLevel('-97,5', 'dBm')).toBe(-97.5);
    expect(parseLevel('9+20', 'dBm')).toBeNaN();
  });

  it('shows the magnetic-to-true sum with the declination side', () => {
    expect(describeTrueAzimuth(212, 'magnetic', 4.3)).toBe('magnetic 212.0° + declination 4.3° E = true 216.3°');
    expect(describeTrueAzimuth(2, 'magnetic', -3.5)).toBe('magnetic 2.0° − declination 3.5° W = true 358.5°');
    expect(describeTrueAzimuth(400, 'true', undefined)).toBe('true 40.0° (no conversion)');
    expect(describeTrueAzimuth(undefined, 'true', 1)).toBeUndefined();
    expect(describeTrueAzimuth(10, 'magnetic', NaN)).toBeUndefined();
  });
});

describe('map drawing helpers (common practice, no source)', () => {
  it('draws lines 2.5 times past the fix, 3 km without one', () => {
    expect(bearingDrawLengthM({ lat: 52, lon: 5 })).toBe(3000);
    // 0.01 degree of latitude is about 1112 m on a sphere of radius 6371 km.
    expect(bearingDrawLengthM({ lat: 52, lon: 5 }, { lat: 52.01, lon: 5 })).toBeCloseTo(2.5 * 1111.95, 0);
    expect(bearingDrawLengthM({ lat: 52, lon: 5 }, { lat: 52, lon: 5 })).toBe(200);
  });

  it('rounds ellipse sizes for labels', () => {
    expect(formatApproxMetres(38)).toBe('~40 m');
    expect(formatApproxMetres(2)).toBe('~5 m');
    expect(formatApproxMetres(347)).toBe('~350 m');
    expect(formatApproxMetres(1240)).toBe('~1.2 km');
  });
});
