'use client';

import { useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import type { ReportInput } from '@/lib/validation/cases';
import { FieldError, plainMessage } from '@/components/ui/field-error';
import { metres } from '@/lib/hunt/words';
import { PositionPickerClient } from '@/components/map/position-picker-client';


/** Above this the device position is rough; tapping the map is better. */
const ROUGH_ACCURACY_M = 100;

const GEO_ERRORS: Record<number, string> = {
  1: 'Location permission was refused. Tap your position on the map instead.',
  2: 'Your device could not find its position. Tap your position on the map instead.',
  3: 'Finding your position took too long. Try again, or tap the map.',
};

/** Where the reporter hears the noise: the device's position, or a tap on the map. */
export function PositionInput() {
  const { control, setValue, formState } = useFormContext<ReportInput>();
  const position = useWatch({ control, name: 'position' });
  const [locating, setLocating] = useState(false);
  const [geoProblem, setGeoProblem] = useState<string | null>(null);
  const e = formState.errors.position;
  const error = plainMessage(e?.lat ?? e?.lon ?? e, 'Set your position: use your location or tap the map.');
  const set = (p: ReportInput['position']) => setValue('position', p, { shouldValidate: formState.isSubmitted, shouldDirty: true });

  function locate() {
    setGeoProblem(null);
    if (!('geolocation' in navigator)) {
      setGeoProblem('This browser cannot share its location. Tap your position on the map instead.');
      return;
    }
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setLocating(false);
        set({ lat: p.coords.latitude, lon: p.coords.longitude, accuracyM: Math.round(p.coords.accuracy), source: 'device' });
      },
      (err) => {
        setLocating(false);
        setGeoProblem(GEO_ERRORS[err.code] ?? 'Your position could not be read. Tap the map instead.');
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  }

  return (
    <fieldset className="space-y-3" aria-describedby={`position-privacy${error ? ' position-error' : ''}`}>
      <legend className="label text-base">Where do you hear it?</legend>
      <p className="text-sm text-ink-soft">Your station’s position: the hunter starts from what you hear there.</p>
      <button type="button" className="btn-quiet w-full sm:w-auto" onClick={locate} disabled={locating}>
        {locating ? 'Finding your position…' : 'Use my location'}
      </button>
      <p aria-live="polite" className="text-sm" data-testid="position-status">
        {position && typeof position.lat === 'number'
          ? `${position.source === 'device' ? 'From your device' : 'From the map'}: ${position.lat.toFixed(5)}, ${position.lon.toFixed(5)}${
              position.accuracyM !== undefined ? ` (within about ${metres(position.accuracyM)})` : ''
            }`
          : 'No position yet.'}
      </p>
      {position?.accuracyM !== undefined && position.accuracyM > ROUGH_ACCURACY_M && (
        <p className="text-sm font-semibold text-flare-700">That is rough. Tap your house on the map to set it more exactly.</p>
      )}
      {geoProblem && <p className="text-sm font-semibold text-alarm-600">{geoProblem}</p>}
      <div>
        <p className="mb-1 text-sm text-ink-soft">Or tap the map at your station.</p>
        <PositionPickerClient
          value={position && typeof position.lat === 'number' ? { lat: position.lat, lon: position.lon } : null}
          accuracyM={position?.accuracyM}
          onPick={(p) => set({ lat: p.lat, lon: p.lon, source: 'map' })}
          className="h-64"
        />
      </div>
      <FieldError id="position-error" message={error} />
      <p id="position-privacy" className="text-sm font-semibold text-hush-900">
        Only the committee and the assigned hunter see your position.
      </p>
    </fieldset>
  );
}
