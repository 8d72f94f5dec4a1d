import type { NullSweepFit } from '@/lib/df';
import { polarPoint, polarScaleDb, sweepModelCurve } from './sweep-model';

/** Plot size in SVG units; the plot scales to its box. */
const SIZE = 260;
const C = SIZE / 2;
const R = 100;
const RING_STEP_DB = 10;

type OkFit = Extract<NullSweepFit, { ok: true }>;

/**
 * A rotation sweep on a polar grid of our own: loop axis azimuth around (0° up, clockwise), level
 * in dB outward. Readings are dots; the fitted figure-eight (P = A sin²(θ − θ0) + B in linear
 * power) is the curve; the null axis is the dashed line.
 * @param samples loop axis azimuth (degrees, in `referenceLabel`) and level (dBm)
 */
export function SweepPolarPlot({ samples, fit, referenceLabel }: { samples: { azimuthDeg: number; levelDbm: number }[]; fit: OkFit | null; referenceLabel: string }) {
  const levels = samples.map((s) => s.levelDbm);
  const scale = polarScaleDb(levels);
  const maxLevel = levels.length ? Math.max(...levels) : 0;
  const curve = fit ? sweepModelCurve(fit.nullAzimuthDeg, maxLevel, fit.nullDepthDb) : [];
  const path = curve.map(([az, db], i) => `${i ? 'L' : 'M'}${polarPoint(az, db, scale, C, C, R).map((v) => v.toFixed(1)).join(' ')}`).join(' ');
  const rings: number[] = [];
  for (let d = RING_STEP_DB; d <= scale.rangeDb; d += RING_STEP_DB) rings.push(d);
  const axis = fit ? [polarPoint(fit.nullAzimuthDeg, scale.topDbm, scale, C, C, R + 8), polarPoint(fit.nullAzimuthDeg + 180, scale.topDbm, scale, C, C, R + 8)] : null;
  const label = `Polar plot of ${samples.length} reading${samples.length === 1 ? '' : 's'}${fit ? `, fitted null at ${fit.nullAzimuthDeg.toFixed(1)}° ${referenceLabel}` : ''}`;

  return (
    <svg viewBox={`0 0 ${SIZE} ${SIZE}`} role="img" aria-label={label} className="mx-auto block w-full max-w-xs" data-testid="sweep-plot">
      <rect width={SIZE} height={SIZE} fill="#fff" />
      {rings.map((d) => (
        <g key={d}>
          <circle cx={C} cy={C} r={(R * d) / scale.rangeDb} fill="none" stroke="#c5ced6" strokeWidth="1" />
          <text x={C + 3} y={C - (R * d) / scale.rangeDb - 2} fontSize="9" fill="#33475b">
            {scale.topDbm - scale.rangeDb + d} dBm
          </text>
        </g>
      ))}
      {[0, 30, 60, 90, 120, 150].map((a) => {
        const [x1, y1] = polarPoint(a, scale.topDbm, scale, C, C, R);
        const [x2, y2] = polarPoint(a + 180, scale.topDbm, scale, C, C, R);
        return <line key={a} x1={x1} y1={y1} x2={x2} y2={y2} stroke="#dde3e8" strokeWidth="1" />;
      })}
      {[0, 90, 180, 270].map((a) => {
        const [x, y] = polarPoint(a, scale.topDbm, scale, C, C, R + 16);
        return (
          <text key={a} x={x} y={y + 4} fontSize="11" fontWeight="700" textAnchor="middle" fill="#0f1d2b">
            {a}°
          </text>
        );
      })}
      {axis && <line x1={axis[0][0]} y1={axis[0][1]} x2={axis[1][0]} y2={axis[1][1]} stroke="#b3261e" strokeWidth="2" strokeDasharray="6 4" data-testid="sweep-null-axis" />}
      {path && <path d={path} fill="none" stroke="#0b5e55" strokeWidth="2" data-testid="sweep-model" />}
      {samples.map((s, i) => {
        const [x, y] = polarPoint(s.azimuthDeg, s.levelDbm, scale, C, C, R);
        return <circle key={i} cx={x} cy={y} r="4" fill="#c8780a" stroke="#0f1d2b" strokeWidth="1" className="qf-sweep-dot" />;
      })}
    </svg>
  );
}
