import { describe, expect, it } from 'vitest';
import { chiSquareUpper, studentTQuantile } from '@/lib/df/internal/statistics';

// Student's t quantiles t(0.975, dof): handbook table values (Abramowitz & Stegun Table 26.10,
// the usual two-sided 5 % column).
describe('Student t quantile', () => {
  it('matches the table to 1e-3', () => {
    const table: [number, number][] = [[1, 12.706], [2, 4.303], [3, 3.182], [4, 2.776], [5, 2.571], [10, 2.228], [30, 2.042]];
    for (const [dof, t] of table) expect(Math.abs(studentTQuantile(0.975, dof) - t)).toBeLessThan(t * 2e-3);
  });
});

// Chi-square upper quantiles, the thresholds of the consistency test, the variance-factor
// widening and the likelihood region: handbook table values (Abramowitz & Stegun Table 26.8,
// the 95 % and 99 % columns; values recalled from memory of the standard table). The
// Wilson-Hilferty approximation above 2 dof is documented as good to about 1 %.
describe('chi-square upper quantile', () => {
  it('matches the table to 1 % (exact for 1 and 2 degrees of freedom)', () => {
    const table: [number, number, number][] = [
      [1, 3.841, 6.635], [2, 5.991, 9.21], [3, 7.815, 11.345], [4, 9.488, 13.277], [5, 11.07, 15.086],
      [6, 12.592, 16.812], [8, 15.507, 20.09], [10, 18.307, 23.209], [20, 31.41, 37.566], [30, 43.773, 50.892],
    ];
    for (const [dof, q95, q99] of table) {
      const tol = dof <= 2 ? 1e-3 : 1e-2;
      expect(Math.abs(chiSquareUpper(0.05, dof) / q95 - 1)).toBeLessThan(tol);
      expect(Math.abs(chiSquareUpper(0.01, dof) / q99 - 1)).toBeLessThan(tol);
    }
    // the Bonferroni thresholds of the rejection use far tails: chi-square(1) at 1e-3 is 10.828
    expect(chiSquareUpper(1e-3, 1)).toBeCloseTo(10.828, 2);
  });
});
