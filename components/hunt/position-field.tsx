'use client';

import { useCallback, useEffect, useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { NoticeBox } from '@/components/ui/notice-box';
import { PositionPickerClient } from '@/components/map/position-picker-client';
import type { BaseFields } from './base-fields';
import { loadPosition, savePosition, type RememberedPosition } from './field-memory';
import { formatLatLon } from './format-position';

type LatLon = { lat: number; lon: number };

/** How long to wait for a device position, milliseconds. */
const GEO_TIMEOUT_MS = 20_000;

export const GEO_ERRORS: Record<number, string> = {
  1: 'Location permission is off for this site. Allow it in the browser settings, or tap your spot on the map.',
  2: 'Your device could not find its position. Try again in the open, or tap your spot on the map.',
  3: 'No position within 20 seconds. Try again, or tap your spot on the map.',
};

/**
 * Where the hunter stands: the device's position (with its accuracy in metres) or a spot tapped on
 * a map. Writes lat, lon, positionSource and positionAccuracyM of the surrounding form, and
 * remembers the last position per case so it survives the phone sleeping.
 */
export function PositionField({
  caseId,
  maxAccuracyM,
  selectedPosition,
  mapCenter,
}: {
  caseId: string;
  /** The club's limit for a device position's accuracy, metres. */
  maxAccuracyM: number;
  /** A position tapped on another map (e.g. the case map); it replaces the current one when it changes. */
  selectedPosition?: LatLon | null;
  /** Where the small map opens when there is no position yet. */
  mapCenter?: LatLon | null;
}) {
  const { setValue, getValues, watch, formState } = useFormContext<BaseFields>();
  const [takenAt, setTakenAt] = useState<string | null>(null);
  const [restored, setRestored] = useState(false);
  const [locating, setLocating] = useState(false);
  const [geoError, setGeoError] = useState<string | null>(null);
  const [showPicker, setShowPicker] = useState(false);

  const apply = useCallback(
    (p: RememberedPosition, remember = true) => {
      const opts = { shouldValidate: formState.isSubmitted, shouldDirty: true };
      setValue('lat', p.lat, opts);
      setValue('lon', p.lon, opts);
      setValue('positionSource', p.source, opts);
      setValue('positionAccuracyM', p.source === 'device' ? p.accuracyM : undefined, opts);
      setValue('accuracyConfirmed', false);
      setTakenAt(p.at);
      if (remember) savePosition(caseId, p);
    },
    [caseId, setValue, formState.isSubmitted],
  );

  // The last position from before the phone slept (first, so a fresh map tap below wins).
  useEffect(() => {
    if (getValues('lat') !== undefined) return;
    const p = loadPosition(caseId);
    if (p) {
      apply(p, false);
      setRestored(true);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [caseId]);

  const selLat = selectedPosition?.lat;
  const selLon = selectedPosition?.lon;
  useEffect(() => {
    if (selLat === undefined || selLon === undefined) return;
    apply({ lat: selLat, lon: selLon, source: 'map', at: new Date().toISOString() });
    setRestored(false);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [selLat, selLon]);

  const locateMe = () => {
    setGeoError(null);
    if (typeof navigator === 'undefined' || !navigator.geolocation) {
      setGeoError('This browser cannot share its location; tap your spot on the map.');
      return;
    }
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setLocating(false);
        setRestored(false);
        apply({ lat: pos.coords.latitude, lon: pos.coords.longitude, source: 'device', accuracyM: pos.coords.accuracy, at: new Date(pos.timestamp).toISOString() });
      },
      (err) => {
        setLocating(false);
        setGeoError(GEO_ERRORS[err.code] ?? 'Your position could not be read; tap your spot on the map.');
      },
      { enableHighAccuracy: true, timeout: GEO_TIMEOUT_MS, maximumAge: 0 },
    );
  };

  const lat = watch('lat');
  const lon = watch('lon');
  const source = watch('positionSource');
  const accuracyM = watch('positionAccuracyM');
  const has = typeof lat === 'number' && typeof lon === 'number' && Number.isFinite(lat) && Number.isFinite(lon);
  const tooCoarse = has && source === 'device' && typeof accuracyM === 'number' && accuracyM > maxAccuracyM;
  const error = formState.errors.lat ?? formState.errors.lon ?? formState.errors.positionSource;

  return (
    <fieldset className="space-y-2" aria-describedby={error ? 'position-error' : undefined}>
      <legend className="label">Where you stand</legend>
      <div className="grid grid-cols-2 gap-2">
        <button type="button" className="btn-primary" onClick={locateMe} disabled={locating}>
          {locating ? 'Locating…' : 'Use my location'}
        </button>
        <button type="button" className="btn-quiet" aria-expanded={showPicker} onClick={() => setShowPicker((v) => !v)}>
          {showPicker ? 'Hide map' : 'Pick on map'}
        </button>
      </div>
      <p className="text-base" data-testid="position-summary" aria-live="polite">
        {has ? (
          <>
            <span className="font-semibold">{formatLatLon(lat, lon)}</span>
            <span className="text-ink-soft">
              {' · '}
              {source === 'device' ? `device${typeof accuracyM === 'number' ? ` ±${Math.round(accuracyM)} m` : ''}` : 'chosen on the map'}
              {takenAt ? ` · ${new Date(takenAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}` : ''}
              {restored ? ' · remembered' : ''}
            </span>
          </>
        ) : (
          <span className="text-ink-soft">No position yet: use your location or tap your spot on a map.</span>
        )}
      </p>
      {tooCoarse && (
        <NoticeBox tone="warn">
          Your device reports ±{Math.round(accuracyM)} m, worse than the club’s limit of {maxAccuracyM} m. Wait a moment and try again in the open, or
          pick your spot on the map.
        </NoticeBox>
      )}
      {geoError && <NoticeBox tone="error">{geoError}</NoticeBox>}
      {error && (
        <p id="position-error" className="text-sm font-semibold text-alarm-600">
          {error.type === 'server' ? error.message : 'Choose a position: use your location or tap your spot on a map.'}
        </p>
      )}
      {showPicker && (
        <PositionPickerClient
          value={has ? { lat, lon } : null}
          accuracyM={source === 'device' ? accuracyM : null}
          center={mapCenter}
          onPick={(p) => {
            setRestored(false);
            apply({ ...p, source: 'map', at: new Date().toISOString() });
          }}
        />
      )}
    </fieldset>
  );
}
