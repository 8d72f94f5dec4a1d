import { describe, expect, it } from 'vitest';
import { dateToDecimalYear, decimalYearToDate, declinationDeg, declinationInfo, magneticToTrue } from '@/lib/df';
import wmm from '../../fixtures/df/wmm2025-test-values.json';

describe('World Magnetic Model 2025 declination', () => {
  // WMM2025 test values, NOAA NCEI/BGS technical report (fixture file)
  it.each(wmm.rows)('year %s, %s km, lat %s, lon %s -> D %s', (year, heightKm, lat, lon, expected) => {
    const date = decimalYearToDate(year);
    expect(Math.abs(declinationDeg(lat, lon, date, heightKm) - expected)).toBeLessThanOrEqual(0.02);
    expect(declinationInfo(lat, lon, date, heightKm).warning).toBeUndefined();
  });

  it('converts decimal years the way the model counts them', () => {
    // 2027 has 365 days: half of it ends 2 July 12:00 UTC (calendar arithmetic)
    expect(decimalYearToDate(2027.5).toISOString()).toBe('2027-07-02T12:00:00.000Z');
    expect(dateToDecimalYear(new Date('2028-01-01T00:00:00Z'))).toBe(2028);
    // 2028 is a leap year: 183 days of 366 is exactly one half
    expect(dateToDecimalYear(new Date('2028-07-02T00:00:00Z'))).toBeCloseTo(2028.5, 12);
  });

  it('warns outside 2025.0-2030.0 instead of failing', () => {
    const info = declinationInfo(80, 0, new Date('2031-03-01T00:00:00Z'));
    expect(Number.isFinite(info.declinationDeg)).toBe(true);
    expect(info.warning).toMatch(/2025/);
    expect(declinationInfo(80, 0, new Date(NaN)).declinationDeg).toBeNaN();
    expect(declinationInfo(91, 0, new Date('2026-01-01')).warning).toBeDefined();
  });

  it('magnetic to true adds the east-positive declination', () => {
    // WMM2025 test value: D = 68.78 at 2025.0, -80, 240 (NOAA NCEI/BGS)
    const t = magneticToTrue(350, -80, 240, decimalYearToDate(2025.0));
    expect(t).toBeCloseTo((350 + 68.78) % 360, 1);
    expect(magneticToTrue(NaN, 0, 0, new Date('2026-01-01'))).toBeNaN();
  });
});
