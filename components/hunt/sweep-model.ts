/**
 * The small-loop pattern used to draw a fitted sweep (pure helpers, no DOM).
 * Model (the one lib/df fitNullSweep fits): received power P(theta) = A sin^2(theta - theta0) + B
 * in linear power (milliwatts), theta the loop AXIS azimuth, theta0 the null; B fills the null.
 */

/**
 * A and B in milliwatts from the fit's null depth and the strongest reading: the model maximum
 * A + B is set to the strongest reading and the minimum B lies `nullDepthDb` below it.
 * @param maxLevelDbm strongest reading, dBm
 * @param nullDepthDb model maximum over minimum, dB (>= 0)
 */
export function sweepAmplitudesMw(maxLevelDbm: number, nullDepthDb: number): { a: number; b: number } {
  const top = 10 ** (maxLevelDbm / 10);
  const b = top / 10 ** (Math.max(nullDepthDb, 0) / 10);
  return { a: top - b, b };
}

/**
 * Level of the model at a loop axis azimuth, dBm.
 * @param azimuthDeg loop axis azimuth, degrees
 * @param nullAzimuthDeg theta0, degrees
 */
export function sweepModelDbm(azimuthDeg: number, nullAzimuthDeg: number, amp: { a: number; b: number }): number {
  const s = Math.sin(((azimuthDeg - nullAzimuthDeg) * Math.PI) / 180);
  return 10 * Math.log10(amp.a * s * s + amp.b);
}

/**
 * The figure-eight all the way round: [azimuth degrees, level dBm] every `stepDeg` from 0 to 360
 * (inclusive, so the curve closes).
 */
export function sweepModelCurve(nullAzimuthDeg: number, maxLevelDbm: number, nullDepthDb: number, stepDeg = 3): [number, number][] {
  const amp = sweepAmplitudesMw(maxLevelDbm, nullDepthDb);
  const out: [number, number][] = [];
  for (let az = 0; az <= 360 + 1e-9; az += stepDeg) out.push([az, sweepModelDbm(az, nullAzimuthDeg, amp)]);
  return out;
}

/**
 * Radial scale of the polar plot in dB: the outer ring at the strongest level rounded up to 5 dB,
 * the centre `rangeDb` below it, where rangeDb covers every level with at least 10 dB, rounded up
 * to 10 dB (so the rings fall on whole 10 dB steps below the top).
 */
export function polarScaleDb(levelsDbm: number[]): { topDbm: number; rangeDb: number } {
  const finite = levelsDbm.filter(Number.isFinite);
  if (finite.length === 0) return { topDbm: 0, rangeDb: 40 };
  const topDbm = Math.ceil(Math.max(...finite) / 5) * 5;
  const span = topDbm - Math.min(...finite);
  return { topDbm, rangeDb: Math.max(10, Math.ceil((span + 3) / 10) * 10) };
}

/**
 * Plot position of a level at an azimuth: compass convention (0 degrees up, clockwise), radius 0
 * at the centre level and `radius` at the top level, clamped to the plot.
 * @returns [x, y] in SVG units around the centre (cx, cy)
 */
export function polarPoint(azimuthDeg: number, levelDbm: number, scale: { topDbm: number; rangeDb: number }, cx: number, cy: number, radius: number): [number, number] {
  const f = Math.min(Math.max((levelDbm - (scale.topDbm - scale.rangeDb)) / scale.rangeDb, 0), 1);
  const t = (azimuthDeg * Math.PI) / 180;
  return [cx + f * radius * Math.sin(t), cy - f * radius * Math.cos(t)];
}
