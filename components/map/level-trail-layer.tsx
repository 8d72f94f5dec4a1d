'use client';

import L from 'leaflet';
import { CircleMarker, Marker, Popup, Tooltip } from 'react-leaflet';
import { formatLatLon } from '@/components/hunt/format-position';
import { levelLabel } from '@/components/field/level-words';

/** One point of a level trail as drawn: smoothed level, and whether it still waits on the phone. */
export type TrailPoint = { key: string; lat: number; lon: number; levelDbm: number; smoothedDbm: number; pending: boolean; label: string };

/** The strongest single reading of a trail (raw, not smoothed): where, when and how loud. */
export type StrongestReading = { lat: number; lon: number; levelDbm: number; level: { unit: 'S' | 'dBm'; value: number }; takenAt: string };

/** Where a trail's readings came from: typed on the walk, or imported from a GPX survey. */
export type TrailSource = 'walk' | 'gpx';

/** One trail: its points in the order taken, the smoothed peak (lib/df trailPeak) and the strongest raw reading. */
export type LevelTrailProps = {
  source: TrailSource;
  points: TrailPoint[];
  peak: { lat: number; lon: number; levelDbm: number } | null;
  strongest: StrongestReading | null;
};

/** Our words for each source, in the legend and beside the marks. */
export const TRAIL_SOURCE_WORDS: Record<TrailSource, string> = { walk: 'Walk', gpx: 'Imported survey' };

/** Five grades from quiet to loud (colour-blind-safe ramp, our own). */
export const TRAIL_GRADES = ['#2b4c7e', '#3f8fa6', '#9bbf4a', '#e0a526', '#c2331f'] as const;

/** The grade index (0..4) of a smoothed level between the quietest and loudest shown. */
export function gradeOf(smoothedDbm: number, min: number, max: number): number {
  if (!(max > min)) return TRAIL_GRADES.length - 1;
  const t = (smoothedDbm - min) / (max - min);
  return Math.min(TRAIL_GRADES.length - 1, Math.max(0, Math.floor(t * TRAIL_GRADES.length)));
}

/** The smoothed range over every trail given: one scale, so a colour means the same level on each. */
export function trailRange(trails: Pick<LevelTrailProps, 'points'>[]): [number, number] {
  const xs = trails.flatMap((t) => t.points.map((p) => p.smoothedDbm)).filter(Number.isFinite);
  return xs.length ? [Math.min(...xs), Math.max(...xs)] : [0, 0];
}

/** Ring of a dot: white on the walk, dark on an imported survey, dashed while waiting on the phone. */
const RING: Record<TrailSource, string> = { walk: '#ffffff', gpx: '#0f1d2b' };

const peakIcon = L.divIcon({
  className: 'qf-trail-peak',
  html: '<span style="display:block;width:26px;height:26px;border-radius:50%;background:#c2331f;border:3px solid #fff;box-shadow:0 0 0 2px #0f1d2b"></span>',
  iconSize: [26, 26],
  iconAnchor: [13, 13],
});

/** A dark square with a white rim and an amber ring: unlike the round smoothed peak (and the reporter's diamond) at a glance, and in sunlight. */
const strongestIconOf = (source: TrailSource) =>
  L.divIcon({
    className: 'qf-trail-strongest',
    html: `<span data-testid="strongest-marker" data-source="${source}" style="display:block;width:20px;height:20px;margin:3px;background:#0f1d2b;border:3px solid #fff;box-shadow:0 0 0 2px #e0a526"></span>`,
    iconSize: [26, 26],
    iconAnchor: [13, 13],
  });
/** Made once per source: a new icon on every render would make Leaflet redraw the marker each time. */
const STRONGEST_ICONS: Record<TrailSource, L.DivIcon> = { walk: strongestIconOf('walk'), gpx: strongestIconOf('gpx') };

/** The level in words as read and in dBm: "S8 (−79 dBm)". */
export const strongestLevelWords = (s: StrongestReading) => (s.level.unit === 'dBm' ? `${Math.round(s.levelDbm * 10) / 10} dBm` : `${levelLabel(s.level)} (${Math.round(s.levelDbm)} dBm)`);

/**
 * One trail on the map: a dot per reading, graded by its smoothed level on the shared `range`;
 * the smoothed peak (round, red) and the strongest single reading (square, with a popup of its
 * level, time and position). `named` adds the source to the marks when several trails are shown.
 */
export function LevelTrailLayer({ source, points, peak, strongest, range, named }: LevelTrailProps & { range: [number, number]; named: boolean }) {
  const [min, max] = range;
  const suffix = named ? ` · ${TRAIL_SOURCE_WORDS[source].toLowerCase()}` : '';
  return (
    <>
      {points.map((p) => (
        <CircleMarker
          key={p.key}
          center={[p.lat, p.lon]}
          radius={7}
          pathOptions={{ color: p.pending ? '#0f1d2b' : RING[source], weight: 2, dashArray: p.pending ? '3 3' : undefined, fillColor: TRAIL_GRADES[gradeOf(p.smoothedDbm, min, max)], fillOpacity: 0.95 }}
        >
          <Tooltip>{p.label}</Tooltip>
        </CircleMarker>
      ))}
      {peak && (
        <Marker position={[peak.lat, peak.lon]} icon={peakIcon} keyboard={false}>
          <Tooltip permanent direction="top" offset={[0, -14]}>
            level peak{suffix}
          </Tooltip>
        </Marker>
      )}
      {strongest && (
        <Marker position={[strongest.lat, strongest.lon]} icon={STRONGEST_ICONS[source]} title={`Strongest reading${suffix}: ${strongestLevelWords(strongest)}`} zIndexOffset={500}>
          <Tooltip permanent direction="bottom" offset={[0, 14]}>
            strongest{suffix}
          </Tooltip>
          <Popup>
            <div data-testid="strongest-popup" className="space-y-0.5 text-sm">
              <p className="font-bold">Strongest single reading{suffix}</p>
              <p>{strongestLevelWords(strongest)}</p>
              <p>{new Date(strongest.takenAt).toLocaleString()}</p>
              <p>{formatLatLon(strongest.lat, strongest.lon)}</p>
            </div>
          </Popup>
        </Marker>
      )}
    </>
  );
}

/**
 * The trails' legend: the shared grades from the quietest to the loudest smoothed level, the
 * marks, and per source a switch to show or hide it (when there are several).
 */
export function LevelTrailLegend({ trails, hidden, onToggle }: { trails: LevelTrailProps[]; hidden: ReadonlySet<TrailSource>; onToggle: (s: TrailSource) => void }) {
  const shown = trails.filter((t) => t.points.length && !hidden.has(t.source));
  const withPoints = trails.filter((t) => t.points.length);
  if (!withPoints.length) return null;
  const [min, max] = trailRange(shown);
  return (
    <div className="space-y-1 text-sm" data-testid="trail-legend" aria-label="Level trail legend">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span className="font-semibold">Level (smoothed):</span>
        {shown.length > 0 && (
          <span className="flex items-center gap-1">
            <span>{Math.round(min)} dBm</span>
            {TRAIL_GRADES.map((c) => (
              <span key={c} aria-hidden="true" className="inline-block h-3 w-5" style={{ background: c }} />
            ))}
            <span>{Math.round(max)} dBm</span>
          </span>
        )}
        {trails.some((t) => t.points.some((p) => p.pending)) && (
          <span className="flex items-center gap-1">
            <span aria-hidden="true" className="inline-block h-3 w-3 rounded-full border-2 border-dashed border-ink" /> not yet sent
          </span>
        )}
        <span className="flex items-center gap-1">
          <span aria-hidden="true" className="inline-block h-3 w-3 rounded-full bg-[#c2331f] ring-2 ring-ink" /> level peak (smoothed over neighbours)
        </span>
        <span className="flex items-center gap-1" data-legend="strongest">
          <span aria-hidden="true" className="mx-0.5 inline-block h-3 w-3 border-2 border-white bg-ink ring-2 ring-[#e0a526]" /> strongest single reading (tap it for level, time, place)
        </span>
      </div>
      {withPoints.length > 1 && (
        <fieldset className="flex flex-wrap gap-2" data-testid="trail-sources">
          <legend className="sr-only">Trails shown</legend>
          {withPoints.map((t) => (
            <label key={t.source} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-ink/20 bg-white px-3 py-1">
              <input type="checkbox" className="h-5 w-5 accent-hush-700" checked={!hidden.has(t.source)} onChange={() => onToggle(t.source)} />
              <span aria-hidden="true" className="inline-block h-3 w-3 rounded-full bg-[#9bbf4a]" style={{ boxShadow: `0 0 0 2px ${t.source === 'walk' ? '#ffffff' : RING.gpx}, 0 0 0 3px #0f1d2b55` }} />
              <span>
                {TRAIL_SOURCE_WORDS[t.source]} ({t.points.length} {t.points.length === 1 ? 'reading' : 'readings'})
              </span>
            </label>
          ))}
        </fieldset>
      )}
    </div>
  );
}
