'use client';

import { useState } from 'react';
import { NoticeBox } from '@/components/ui/notice-box';
import { useGeolocation } from '@/components/ui/use-geolocation';
import { formatLatLon } from '@/components/hunt/format-position';
import { PositionPickerClient } from './position-picker-client';

/** A chosen position: WGS84 degrees, from the device (with its accuracy, metres) or a tap on the map. */
export type ChosenPosition = { lat: number; lon: number; source: 'device' | 'map'; accuracyM?: number; at?: string; remembered?: boolean };

/**
 * Where someone stands or listens, the one way every form asks it: "Use my location" (the
 * device's position through useGeolocation) or a tap on the map. Controlled: the form owns the
 * value and says what "too rough" means for it.
 */
export function PositionChooser({
  legend,
  value,
  onChange,
  roughAboveM,
  roughAdvice,
  error,
  mapCenter,
  mapAlwaysOpen = false,
  statusTestId = 'position-summary',
  children,
}: {
  legend: string;
  value: ChosenPosition | null;
  onChange: (p: ChosenPosition) => void;
  /** Device positions less accurate than this (metres) get `roughAdvice`. */
  roughAboveM: number;
  roughAdvice: (accuracyM: number) => string;
  /** A plain message from the form's validation, if any. */
  error?: string | null;
  /** Where the map opens when there is no position yet. */
  mapCenter?: { lat: number; lon: number } | null;
  /** Show the map at once (the report) rather than behind "Pick on map" (the field). */
  mapAlwaysOpen?: boolean;
  statusTestId?: string;
  /** More words under the legend (what the position is for, who sees it). */
  children?: React.ReactNode;
}) {
  const geo = useGeolocation();
  const [showPicker, setShowPicker] = useState(mapAlwaysOpen);
  const rough = value?.source === 'device' && value.accuracyM !== undefined && value.accuracyM > roughAboveM;
  const when = value?.at ? ` · ${new Date(value.at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}` : '';

  return (
    <fieldset className="space-y-2" aria-describedby={error ? 'position-error' : undefined}>
      <legend className="label">{legend}</legend>
      {children}
      <div className="grid grid-cols-2 gap-2">
        <button type="button" className="btn-primary" onClick={() => geo.locate((p) => onChange({ ...p, source: 'device' }))} disabled={geo.locating}>
          {geo.locating ? 'Locating…' : 'Use my location'}
        </button>
        {!mapAlwaysOpen && (
          <button type="button" className="btn-quiet" aria-expanded={showPicker} onClick={() => setShowPicker((v) => !v)}>
            {showPicker ? 'Hide map' : 'Pick on map'}
          </button>
        )}
      </div>
      <p className="text-base" data-testid={statusTestId} aria-live="polite">
        {value ? (
          <>
            <span className="font-semibold">{formatLatLon(value.lat, value.lon)}</span>
            <span className="text-ink-soft">
              {' · '}
              {value.source === 'device' ? `device${value.accuracyM !== undefined ? ` ±${Math.round(value.accuracyM)} m` : ''}` : 'chosen on the map'}
              {when}
              {value.remembered ? ' · remembered' : ''}
            </span>
          </>
        ) : (
          <span className="text-ink-soft">No position yet: use your location or tap your spot on the map.</span>
        )}
      </p>
      {rough && <NoticeBox tone="warn">{roughAdvice(value.accuracyM!)}</NoticeBox>}
      {geo.problem && <NoticeBox tone="error">{geo.problem}</NoticeBox>}
      {error && (
        <p id="position-error" className="text-sm font-semibold text-alarm-600">
          {error}
        </p>
      )}
      {showPicker && (
        <PositionPickerClient
          value={value ? { lat: value.lat, lon: value.lon } : null}
          accuracyM={value?.source === 'device' ? value.accuracyM : null}
          center={mapCenter}
          onPick={(p) => onChange({ lat: p.lat, lon: p.lon, source: 'map', at: new Date().toISOString() })}
          className={mapAlwaysOpen ? 'h-64' : undefined}
        />
      )}
    </fieldset>
  );
}
