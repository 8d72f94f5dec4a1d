import type { LineRow } from './solve-lines';
import { chiSquareUpper } from './statistics';
import { invertSym2, type Sym2 } from './sym2';

/** Family-wise false-flag probability of the outlier test on clean data. */
export const OUTLIER_FAMILY_ALPHA = 0.01;

/**
 * The line whose removal lowers the cost most, if that drop is significant.
 *
 * Leave-one-out without re-solving: for a linear(ised) weighted least-squares fit, removing
 * row i lowers the cost by w r^2 / (1 - h), h = w J N^-1 J' being the row's leverage (rank-one
 * downdate of the normal matrix N). Under clean data that drop is chi-square with 1 degree of
 * freedom; the threshold uses a Bonferroni correction for the number of lines tested.
 * Needs at least 4 lines. Returns the row index or -1.
 */
export function worstOutlier(rows: LineRow[], normal: Sym2): number {
  if (rows.length < 4) return -1;
  const inv = invertSym2(normal);
  if (!inv) return -1;
  const threshold = chiSquareUpper(OUTLIER_FAMILY_ALPHA / rows.length, 1);
  let worst = -1;
  let worstDrop = threshold;
  for (let i = 0; i < rows.length; i++) {
    const { jE, jN, residualRad, line } = rows[i];
    const h = line.weight * (jE * (inv[0] * jE + inv[1] * jN) + jN * (inv[1] * jE + inv[2] * jN));
    if (!(1 - h > 1e-6)) continue; // this line alone fixes a direction: cannot be judged
    const drop = (line.weight * residualRad * residualRad) / (1 - h);
    if (drop > worstDrop) {
      worstDrop = drop;
      worst = i;
    }
  }
  return worst;
}
