import type { Ellipse } from '../types';
import { foldDeg180 } from './angles';
import { chiSquare2Scale } from './statistics';
import { eigenSym2, invertSym2, type Sym2 } from './sym2';

/**
 * Error ellipse from the information matrix J'WJ (east/north, 1/m^2): covariance is its inverse;
 * semi-axes are the square roots of the covariance eigenvalues scaled by sqrt(-2 ln(1 - p)),
 * the chi-square quantile with 2 degrees of freedom (Stansfield 1947; maximum likelihood).
 * Null when the matrix cannot be inverted.
 */
export function ellipseFromNormal(normal: Sym2, confidence: number): Ellipse | null {
  const cov = invertSym2(normal);
  if (!cov) return null;
  const e = eigenSym2(cov);
  const k = chiSquare2Scale(confidence);
  return {
    semiMajorM: k * Math.sqrt(Math.max(e.major, 0)),
    semiMinorM: k * Math.sqrt(Math.max(e.minor, 0)),
    // eigenvector (east, north) -> azimuth clockwise from north
    majorAxisAzimuthDeg: foldDeg180((Math.atan2(e.vx, e.vy) * 180) / Math.PI),
    confidence,
  };
}
