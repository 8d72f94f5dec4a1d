import { describe, expect, it } from 'vitest';
import { studentTQuantile } from '@/lib/df/internal/statistics';

// Student's t quantiles t(0.975, dof): handbook table values (Abramowitz & Stegun Table 26.10,
// the usual two-sided 5 % column).
describe('Student t quantile', () => {
  it('matches the table to 1e-3', () => {
    const table: [number, number][] = [[1, 12.706], [2, 4.303], [3, 3.182], [4, 2.776], [5, 2.571], [10, 2.228], [30, 2.042]];
    for (const [dof, t] of table) expect(Math.abs(studentTQuantile(0.975, dof) - t)).toBeLessThan(t * 2e-3);
  });
});
