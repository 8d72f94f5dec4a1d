'use client';

import { useCallback, useEffect, useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { PositionChooser, type ChosenPosition } from '@/components/map/position-chooser';
import type { BaseFields } from './base-fields';
import { loadPosition, savePosition } from './field-memory';

type LatLon = { lat: number; lon: number };

/**
 * Where the hunter stands, through the one PositionChooser: writes lat, lon, positionSource and
 * positionAccuracyM of the surrounding form, and remembers the last position per case so it
 * survives the phone sleeping.
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
  const [meta, setMeta] = useState<{ at?: string; remembered?: boolean }>({});

  const apply = useCallback(
    (p: ChosenPosition, remember = true) => {
      const opts = { shouldValidate: formState.isSubmitted, shouldDirty: true };
      setValue('lat', p.lat, opts);
      setValue('lon', p.lon, opts);
      setValue('positionSource', p.source, opts);
      setValue('positionAccuracyM', p.source === 'device' ? p.accuracyM : undefined, opts);
      setValue('accuracyConfirmed', false);
      const at = p.at ?? new Date().toISOString();
      setMeta({ at, remembered: !remember });
      if (remember) savePosition(caseId, { lat: p.lat, lon: p.lon, source: p.source, accuracyM: p.accuracyM, at });
    },
    [caseId, setValue, formState.isSubmitted],
  );

  // The last position from before the phone slept (first, so a fresh map tap below wins).
  useEffect(() => {
    if (getValues('lat') !== undefined) return;
    const p = loadPosition(caseId);
    if (p) apply(p, false);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [caseId]);

  const selLat = selectedPosition?.lat;
  const selLon = selectedPosition?.lon;
  useEffect(() => {
    if (selLat === undefined || selLon === undefined) return;
    apply({ lat: selLat, lon: selLon, source: 'map' });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [selLat, selLon]);

  const lat = watch('lat');
  const lon = watch('lon');
  const source = watch('positionSource');
  const accuracyM = watch('positionAccuracyM');
  const has = typeof lat === 'number' && typeof lon === 'number' && Number.isFinite(lat) && Number.isFinite(lon);
  const error = formState.errors.lat ?? formState.errors.lon ?? formState.errors.positionSource;

  return (
    <PositionChooser
      legend="Where you stand"
      value={has ? { lat, lon, source: source ?? 'map', accuracyM: accuracyM ?? undefined, ...meta } : null}
      onChange={(p) => apply(p)}
      roughAboveM={maxAccuracyM}
      roughAdvice={(m) => `Your device reports ±${Math.round(m)} m, worse than the club’s limit of ${maxAccuracyM} m. Wait a moment and try again in the open, or pick your spot on the map.`}
      error={error ? (error.type === 'server' ? error.message : 'Choose a position: use your location or tap your spot on a map.') : null}
      mapCenter={mapCenter}
    />
  );
}
