/** Small statistical helpers (no dependencies). */

/**
 * Scale from 1-sigma to a confidence region for a 2-D normal: sqrt of the chi-square quantile
 * with 2 degrees of freedom, sqrt(-2 ln(1 - p)). For p = 0.95 this is 2.4477.
 */
export function chiSquare2Scale(confidence: number): number {
  return Math.sqrt(-2 * Math.log(1 - confidence));
}

/**
 * Standard normal quantile (inverse CDF), rational approximation of P. J. Acklam (relative
 * error below 1.2e-9), for p in (0, 1).
 */
export function normalQuantile(p: number): number {
  const a = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239];
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572];
  const c = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const tail = (q: number) =>
    (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  if (p < 0.02425) return tail(Math.sqrt(-2 * Math.log(p)));
  if (p > 1 - 0.02425) return -tail(Math.sqrt(-2 * Math.log(1 - p)));
  const q = p - 0.5;
  const r = q * q;
  return ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
    (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
}

/**
 * Upper quantile of the chi-square distribution: the value exceeded with probability alpha.
 * Exact for 1 degree of freedom (square of a normal quantile); Wilson-Hilferty approximation
 * otherwise (good to about 1 % for the degrees of freedom used here).
 */
export function chiSquareUpper(alpha: number, dof: number): number {
  if (dof === 1) {
    const z = normalQuantile(1 - alpha / 2);
    return z * z;
  }
  if (dof === 2) return -2 * Math.log(alpha);
  const z = normalQuantile(1 - alpha);
  const h = 2 / (9 * dof);
  return dof * Math.pow(1 - h + z * Math.sqrt(h), 3);
}

/**
 * Upper quantile of Student's t distribution: t with P(T <= t) = p, dof degrees of freedom.
 * Exact for 1 and 2 dof; otherwise the Cornish-Fisher expansion in the normal quantile,
 * Abramowitz & Stegun 26.7.5 (four terms; better than 1e-3 relative from 3 dof up).
 */
export function studentTQuantile(p: number, dof: number): number {
  if (dof === 1) return Math.tan(Math.PI * (p - 0.5));
  if (dof === 2) return (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
  const x = normalQuantile(p);
  const x2 = x * x, v = dof;
  const g1 = (x2 * x + x) / 4;
  const g2 = ((5 * x2 + 16) * x2 * x + 3 * x) / 96;
  const g3 = (((3 * x2 + 19) * x2 + 17) * x2 * x - 15 * x) / 384;
  const g4 = ((((79 * x2 + 776) * x2 + 1482) * x2 - 1920) * x2 * x - 945 * x) / 92160;
  return x + g1 / v + g2 / (v * v) + g3 / (v * v * v) + g4 / (v * v * v * v);
}
