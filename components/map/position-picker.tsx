'use client';

import 'leaflet/dist/leaflet.css';
import { useEffect } from 'react';
import { Circle, MapContainer, useMap } from 'react-leaflet';
import { DomEvent } from 'leaflet';
import { BaseLayers } from './base-layers';
import { MapTap, type LatLon } from './map-tap';
import { PALETTE, PLAIN_BACKGROUND } from './map-styles';
import { PickedPositionMarker } from './picked-position-marker';

export type PositionPickerProps = {
  /** The chosen position, WGS84 degrees. */
  value?: LatLon | null;
  /** Radius of the accuracy circle around the chosen position, metres. */
  accuracyM?: number | null;
  /** Where to look when nothing is chosen yet (e.g. the case's area). */
  center?: LatLon | null;
  onPick: (p: LatLon) => void;
  className?: string;
};

/** Keeps the chosen position in view when it changes from outside (e.g. a device fix). */
function FollowValue({ value }: { value?: LatLon | null }) {
  const map = useMap();
  useEffect(() => {
    if (!value) return;
    if (!map.getBounds().contains([value.lat, value.lon])) map.setView([value.lat, value.lon], Math.max(map.getZoom(), 16));
  }, [map, value]);
  return null;
}

/** Hands the map to the "pick the map centre" button (keyboard users pan with the arrow keys). */
function CentreButton({ onPick }: { onPick: (p: LatLon) => void }) {
  const map = useMap();
  return (
    <button
      type="button"
      // Keep the button's own clicks from reaching the map as a tap.
      ref={(el) => {
        if (el) DomEvent.disableClickPropagation(el);
      }}
      className="btn-quiet absolute right-2 bottom-6 z-[1000] text-sm"
      onClick={() => {
        const c = map.getCenter().wrap();
        onPick({ lat: c.lat, lon: c.lng });
      }}
    >
      Use map centre
    </button>
  );
}

/** A small map to tap a position on. Browser only (load through PositionPickerClient). */
export default function PositionPicker({ value, accuracyM, center, onPick, className }: PositionPickerProps) {
  const start = value ?? center;
  return (
    <div role="region" aria-label="Pick a position on the map" data-testid="position-picker" className={`relative isolate overflow-hidden rounded-lg border border-ink/20 ${className ?? 'h-64'}`}>
      <MapContainer center={start ? [start.lat, start.lon] : [20, 0]} zoom={start ? 16 : 2} className="h-full w-full" style={{ background: PLAIN_BACKGROUND }} attributionControl={false}>
        <BaseLayers />
        <MapTap onTap={onPick} />
        <FollowValue value={value} />
        {value && accuracyM !== null && accuracyM !== undefined && accuracyM > 0 && (
          <Circle
            center={[value.lat, value.lon]}
            radius={accuracyM}
            className="qf-accuracy"
            pathOptions={{ color: PALETTE.flare700, weight: 1.5, fillColor: PALETTE.flare500, fillOpacity: 0.12 }}
            interactive={false}
          />
        )}
        {value && <PickedPositionMarker position={value} />}
        <div className="pointer-events-none absolute top-1/2 left-1/2 z-[500] h-4 w-4 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-ink/40" aria-hidden="true" />
        <CentreButton onPick={onPick} />
      </MapContainer>
    </div>
  );
}
