'use client';

import L from 'leaflet';
import { CircleMarker, Marker, Tooltip } from 'react-leaflet';

/** One point of the walked level trail as drawn: smoothed level, and whether it still waits on the phone. */
export type TrailPoint = { key: string; lat: number; lon: number; levelDbm: number; smoothedDbm: number; pending: boolean; label: string };
export type LevelTrailProps = { points: TrailPoint[]; peak: { lat: number; lon: number; levelDbm: number } | null };

/** Five grades from quiet to loud (colour-blind-safe ramp, our own). */
export const TRAIL_GRADES = ['#2b4c7e', '#3f8fa6', '#9bbf4a', '#e0a526', '#c2331f'] as const;

/** The grade index (0..4) of a smoothed level between the trail's quietest and loudest. */
export function gradeOf(smoothedDbm: number, min: number, max: number): number {
  if (!(max > min)) return TRAIL_GRADES.length - 1;
  const t = (smoothedDbm - min) / (max - min);
  return Math.min(TRAIL_GRADES.length - 1, Math.max(0, Math.floor(t * TRAIL_GRADES.length)));
}

export function trailRange(points: TrailPoint[]): [number, number] {
  const xs = points.map((p) => p.smoothedDbm).filter(Number.isFinite);
  return xs.length ? [Math.min(...xs), Math.max(...xs)] : [0, 0];
}

const peakIcon = L.divIcon({
  className: 'qf-trail-peak',
  html: '<span style="display:block;width:26px;height:26px;border-radius:50%;background:#c2331f;border:3px solid #fff;box-shadow:0 0 0 2px #0f1d2b"></span>',
  iconSize: [26, 26],
  iconAnchor: [13, 13],
});

/** The walk on the map: one dot per reading, graded by the smoothed level; the smoothed peak marked. */
export function LevelTrailLayer({ points, peak }: LevelTrailProps) {
  const [min, max] = trailRange(points);
  return (
    <>
      {points.map((p) => (
        <CircleMarker
          key={p.key}
          center={[p.lat, p.lon]}
          radius={7}
          pathOptions={{ color: p.pending ? '#0f1d2b' : '#ffffff', weight: 2, dashArray: p.pending ? '3 3' : undefined, fillColor: TRAIL_GRADES[gradeOf(p.smoothedDbm, min, max)], fillOpacity: 0.95 }}
        >
          <Tooltip>{p.label}</Tooltip>
        </CircleMarker>
      ))}
      {peak && (
        <Marker position={[peak.lat, peak.lon]} icon={peakIcon} keyboard={false}>
          <Tooltip permanent direction="top" offset={[0, -14]}>
            level peak
          </Tooltip>
        </Marker>
      )}
    </>
  );
}

/** The trail's legend: the grades from its quietest to its loudest smoothed level, and the marks. */
export function LevelTrailLegend({ points }: { points: TrailPoint[] }) {
  if (!points.length) return null;
  const [min, max] = trailRange(points);
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm" data-testid="trail-legend" aria-label="Level trail legend">
      <span className="font-semibold">Walk:</span>
      <span className="flex items-center gap-1">
        <span>{Math.round(min)} dBm</span>
        {TRAIL_GRADES.map((c) => (
          <span key={c} aria-hidden="true" className="inline-block h-3 w-5" style={{ background: c }} />
        ))}
        <span>{Math.round(max)} dBm</span>
      </span>
      <span className="flex items-center gap-1">
        <span aria-hidden="true" className="inline-block h-3 w-3 rounded-full border-2 border-dashed border-ink" /> not yet sent
      </span>
      <span className="flex items-center gap-1">
        <span aria-hidden="true" className="inline-block h-3 w-3 rounded-full bg-[#c2331f] ring-2 ring-ink" /> level peak (smoothed)
      </span>
    </div>
  );
}
