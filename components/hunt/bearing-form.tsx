'use client';

import { FormProvider } from 'react-hook-form';
import { TextField } from '@/components/ui/text-field';
import type { BearingView, CaseDetail, FixView } from '@/lib/hunt/views';
import { bearingInputSchema } from '@/lib/validation/bearings';
import { BASE_ERROR_FIELDS } from './base-fields';
import { ReferenceField } from './common-bearing-fields';
import { CompassReader } from './compass-reader';
import { NoHuntRights } from './form-sheet-parts';
import { FormTail } from './form-tail';
import { NullSharpnessField } from './null-sharpness-field';
import { parseDecimal } from './number-text';
import { PositionField } from './position-field';
import { TrueAzimuthPreview } from './true-azimuth-preview';
import { useHuntForm } from './use-hunt-form';

const ERROR_FIELDS = { ...BASE_ERROR_FIELDS, azimuthDeg: 'azimuthDeg', sigmaDeg: 'sigmaDeg', nullWidthDeg: 'nullWidthDeg', quality: 'quality' };

export type BearingFormProps = {
  caseId: string;
  caseDetail: CaseDetail;
  /** Frequency to start with, kilohertz (e.g. the reported one). */
  defaultFrequencyKhz?: number;
  /** A position tapped on the case map, WGS84 degrees. */
  selectedPosition?: { lat: number; lon: number } | null;
  onSaved: () => void;
};

/** Adding one null bearing: where you stand, the azimuth (typed or from the compass), how sharp the null was. */
export function BearingForm({ caseId, caseDetail, defaultFrequencyKhz, selectedPosition, onSaved }: BearingFormProps) {
  const { form: methods, submit, problem, pending, resend } = useHuntForm<typeof bearingInputSchema, { bearing: BearingView; fix: FixView }>(bearingInputSchema, {
    url: `/api/cases/${caseId}/bearings`,
    defaultValues: { reference: 'magnetic', quality: 'fair', oneWay: false, note: '', accuracyConfirmed: false, frequencyKhz: defaultFrequencyKhz },
    errorFields: ERROR_FIELDS,
    onSaved: () => {
      // Ready for the next bearing: position, reference and frequency stay.
      methods.reset({ ...methods.getValues(), azimuthDeg: undefined as unknown as number, nullWidthDeg: undefined, note: '', accuracyConfirmed: false });
      onSaved();
    },
  });
  const { register, setValue, watch, formState } = methods;

  if (!caseDetail.can.hunt) return <NoHuntRights />;

  const lat = watch('lat');
  const lon = watch('lon');
  const position = typeof lat === 'number' && typeof lon === 'number' ? { lat, lon } : null;
  const azimuth = watch('azimuthDeg');

  return (
    <FormProvider {...methods}>
      <form noValidate aria-label="Add a bearing" className="space-y-4" onSubmit={submit}>
        <PositionField caseId={caseId} maxAccuracyM={caseDetail.maxPositionAccuracyM} selectedPosition={selectedPosition} mapCenter={caseDetail.reportedPosition} />
        <div className="space-y-2">
          <TextField
            id="bearing-azimuth"
            label="Azimuth of the null (degrees)"
            hint="0 to 360, clockwise from north, along the null."
            inputMode="decimal"
            autoComplete="off"
            className="field text-2xl font-bold tabular-nums"
            error={formState.errors.azimuthDeg}
            registration={register('azimuthDeg', { setValueAs: parseDecimal })}
          />
          <CompassReader
            onReading={(deg) => {
              setValue('azimuthDeg', deg, { shouldValidate: formState.isSubmitted, shouldDirty: true });
              setValue('reference', 'magnetic');
            }}
          />
        </div>
        <ReferenceField />
        <TrueAzimuthPreview azimuthDeg={typeof azimuth === 'number' ? azimuth : undefined} reference={watch('reference')} position={position} />
        <NullSharpnessField />
        <FormTail idPrefix="bearing" problem={problem} pending={pending} onConfirm={() => void resend({ accuracyConfirmed: true })} saveLabel="Save bearing" />
      </form>
    </FormProvider>
  );
}
