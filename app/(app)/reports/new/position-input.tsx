'use client';

import { useFormContext, useWatch } from 'react-hook-form';
import type { ReportInput } from '@/lib/validation/cases';
import { plainMessage } from '@/components/ui/field-error';
import { PositionChooser } from '@/components/map/position-chooser';

/** Above this the device position is rough; tapping the map is better (common practice, no source). */
const ROUGH_ACCURACY_M = 100;

/** Where the reporter hears the noise, through the one PositionChooser (the device's position, or a tap on the map). */
export function PositionInput() {
  const { control, setValue, formState } = useFormContext<ReportInput>();
  const position = useWatch({ control, name: 'position' });
  const e = formState.errors.position;
  const error = plainMessage(e?.lat ?? e?.lon ?? e, 'Set your position: use your location or tap the map.');
  return (
    <PositionChooser
      legend="Where do you hear it?"
      value={position && typeof position.lat === 'number' ? position : null}
      onChange={(p) =>
        setValue(
          'position',
          { lat: p.lat, lon: p.lon, source: p.source, ...(p.accuracyM !== undefined ? { accuracyM: Math.round(p.accuracyM) } : {}) },
          { shouldValidate: formState.isSubmitted, shouldDirty: true },
        )
      }
      roughAboveM={ROUGH_ACCURACY_M}
      roughAdvice={() => 'That is rough. Tap your house on the map to set it more exactly.'}
      error={error}
      mapAlwaysOpen
      statusTestId="position-status"
    >
      <p className="text-sm text-ink-soft">Your station’s position: the hunter starts from what you hear there.</p>
      <p id="position-privacy" className="text-sm font-semibold text-hush-900">
        Only the committee and the assigned hunter see your position.
      </p>
    </PositionChooser>
  );
}
