'use client';

import 'leaflet/dist/leaflet.css';
import { useMemo, useState } from 'react';
import { MapContainer } from 'react-leaflet';
import { ellipsePolygon, type NextSpot } from '@/lib/df';
import type { BearingView, FixView } from '@/lib/hunt/views';
import { BaseLayers } from './base-layers';
import { BearingLayers, FixLayers, ReporterMarker, SpotMarkers, TrailLayer } from './case-map-layers';
import { CaseMapLegend, type LegendKey } from './case-map-legend';
import { FitBoundsOnce } from './fit-bounds-once';
import { FlyTo, type MapFocus } from './fly-to';
import type { PlacesHighlight } from './places-layer';
import { MapTap, type LatLon } from './map-tap';
import { PLAIN_BACKGROUND } from './map-styles';
import { PickedPositionMarker } from './picked-position-marker';
import { LevelTrailLayer, LevelTrailLegend, trailRange, type LevelTrailProps, type TrailSource } from './level-trail-layer';

export type CaseMapProps = {
  bearings: BearingView[];
  fix?: FixView;
  /** Shown only to people allowed to see it (the API leaves it out otherwise). */
  reportedPosition?: LatLon | null;
  /** The position chosen for the next bearing. */
  selectedPosition?: LatLon | null;
  onMapTap?: (p: LatLon) => void;
  onSpotSelect?: (s: NextSpot) => void;
  /** Candidate houses, confirmed premises and picking a building on the places layer. */
  places?: PlacesHighlight;
  /** Move the map here (a new key moves it again). */
  focus?: MapFocus | null;
  /** The level trails, one per source (walk, imported survey), graded on one scale; each can be hidden from the legend. */
  levelTrails?: LevelTrailProps[];
  className?: string;
};

/** Start view before there is anything to show: the whole world. */
const WORLD: { center: [number, number]; zoom: number } = { center: [20, 0], zoom: 2 };

/**
 * The hunt on a map: lines of bearing, crossings, the fix with its 95 % error ellipse, how the
 * fix converged and where to stand next. Browser only (load through CaseMapClient).
 */
export default function CaseMap({ bearings, fix, reportedPosition, selectedPosition, onMapTap, onSpotSelect, places, focus, levelTrails, className }: CaseMapProps) {
  const current = fix?.current?.fix;
  const okFix = current && current.ok ? current : null;
  const outlierIds = useMemo(() => new Set(okFix?.outlierIds ?? []), [okFix]);
  const spots = useMemo(() => fix?.nextSpots ?? [], [fix]);
  const [hiddenTrails, setHiddenTrails] = useState<ReadonlySet<TrailSource>>(new Set());
  const trails = useMemo(() => (levelTrails ?? []).filter((t) => t.points.length), [levelTrails]);
  const shownTrails = trails.filter((t) => !hiddenTrails.has(t.source));
  // An import is a deliberate act: the map fits again to show it (a walk's every reading does not move it).
  const surveyCount = trails.find((t) => t.source === 'gpx')?.points.length ?? 0;
  const toggleTrail = (s: TrailSource) => setHiddenTrails((h) => (h.has(s) ? new Set([...h].filter((x) => x !== s)) : new Set([...h, s])));

  const fitPoints = useMemo(() => {
    const pts: [number, number][] = bearings.map((b) => [b.lat, b.lon]);
    if (okFix) pts.push(...ellipsePolygon(okFix, okFix.ellipse, 16));
    for (const s of spots) pts.push([s.lat, s.lon]);
    if (reportedPosition) pts.push([reportedPosition.lat, reportedPosition.lon]);
    for (const t of trails) for (const p of t.points) pts.push([p.lat, p.lon]);
    return pts;
  }, [bearings, okFix, spots, reportedPosition, trails]);

  const legend: LegendKey[] = [];
  if (bearings.some((b) => !b.excluded && !outlierIds.has(b.id))) legend.push('bearing');
  if (bearings.some((b) => !b.excluded && outlierIds.has(b.id))) legend.push('outlier');
  if (bearings.some((b) => b.excluded)) legend.push('excluded');
  if (bearings.length) legend.push('observer');
  if (okFix?.intersections.length) legend.push('cross');
  if (okFix) legend.push('fix', 'ellipse');
  if (okFix?.allLines) legend.push('alternative');
  if (fix?.trail.some((t) => t.ok && t.lat !== null)) legend.push('trail');
  if (spots.length) legend.push('spot');
  if (reportedPosition) legend.push('reporter');
  if (selectedPosition) legend.push('picked');
  if (places?.candidateIds?.size) legend.push('candidate');
  if (places?.premisesPlaceId || places?.pickedPlaceId) legend.push('premises');

  const start = reportedPosition ?? selectedPosition;
  return (
    <div role="region" aria-label="Case map" data-testid="case-map">
      {/* className sizes the map itself; the legend follows below it. */}
      <div className={`relative isolate overflow-hidden rounded-lg border border-ink/20 ${className ?? 'h-80'}`}>
        <MapContainer
          center={start ? [start.lat, start.lon] : WORLD.center}
          zoom={start ? 15 : WORLD.zoom}
          className="h-full w-full"
          style={{ background: PLAIN_BACKGROUND }}
          worldCopyJump
          attributionControl={false}
        >
          <BaseLayers places={places} />
          <MapTap onTap={onMapTap} />
          {fix && <TrailLayer fix={fix} />}
          <BearingLayers bearings={bearings} outlierIds={outlierIds} fix={okFix} />
          {fix && <FixLayers fix={fix} />}
          {reportedPosition && <ReporterMarker position={reportedPosition} />}
          {selectedPosition && <PickedPositionMarker position={selectedPosition} label="next bearing here" />}
          <SpotMarkers spots={spots} onSelect={onSpotSelect} />
          {shownTrails.map((t) => (
            <LevelTrailLayer key={t.source} {...t} range={trailRange(shownTrails)} named={trails.length > 1} />
          ))}
          <FlyTo focus={focus} />
          <FitBoundsOnce points={fitPoints} complete={fix !== undefined} refitKey={`${bearings.filter((b) => !b.excluded).length}:${surveyCount}`} holdKey={focus?.key} />
        </MapContainer>
      </div>
      <CaseMapLegend keys={legend} />
      <LevelTrailLegend trails={trails} hidden={hiddenTrails} onToggle={toggleTrail} />
    </div>
  );
}
