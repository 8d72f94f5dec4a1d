/** 2x2 symmetric matrices [a, b, c] meaning [[a, b], [b, c]]. */
export type Sym2 = [number, number, number];

/** Inverse of a symmetric 2x2 matrix, or null when (numerically) singular. */
export function invertSym2(m: Sym2): Sym2 | null {
  const [a, b, c] = m;
  const det = a * c - b * b;
  const scale = Math.max(Math.abs(a), Math.abs(c));
  if (!(det > scale * scale * 1e-12) || !Number.isFinite(det)) return null;
  return [c / det, -b / det, a / det];
}

/** Eigen-decomposition of a symmetric 2x2 matrix: larger eigenvalue first, with its unit eigenvector [x, y]. */
export function eigenSym2(m: Sym2): { major: number; minor: number; vx: number; vy: number } {
  const [a, b, c] = m;
  const mean = (a + c) / 2;
  const half = Math.hypot((a - c) / 2, b);
  const major = mean + half;
  const minor = mean - half;
  // Direction of the major axis: angle t with tan(2t) = 2b / (a - c).
  const t = 0.5 * Math.atan2(2 * b, a - c);
  return { major, minor, vx: Math.cos(t), vy: Math.sin(t) };
}
