'use client';

import { useMemo } from 'react';
import { FormProvider } from 'react-hook-form';
import type { z } from 'zod';
import { fitNullSweep, sUnitsToDbm } from '@/lib/df';
import type { BearingView, FixView } from '@/lib/hunt/views';
import { sweepInputSchema } from '@/lib/validation/bearings';
import { BASE_ERROR_FIELDS } from './base-fields';
import type { BearingFormProps } from './bearing-form';
import { ChoiceButtons } from './choice-buttons';
import { ReferenceField } from './common-bearing-fields';
import { NoHuntRights } from './form-sheet-parts';
import { FormTail } from './form-tail';
import { PositionField } from './position-field';
import { SweepPolarPlot } from './sweep-polar-plot';
import { SweepReadingsTable } from './sweep-readings-table';
import { TrueAzimuthPreview } from './true-azimuth-preview';
import { useHuntForm } from './use-hunt-form';

type In = z.input<typeof sweepInputSchema>;

const ERROR_FIELDS = { ...BASE_ERROR_FIELDS, samples: 'samples', levelUnit: 'samples' };

/** Frequency used to pick the S9 reference when none is given, hertz (HF: S9 = -73 dBm). */
const DEFAULT_S_METER_HZ = 7e6;

const UNITS = [
  { value: 'dBm', label: 'dBm' },
  { value: 'S', label: 'S-units' },
] as const;

/** A rotation sweep: levels read at several loop angles, fitted for the null, saved as a bearing. */
export function SweepEntry({ caseId, caseDetail, defaultFrequencyKhz, selectedPosition, onSaved }: BearingFormProps) {
  const { form: methods, submit, problem, pending, resend } = useHuntForm<typeof sweepInputSchema, { bearing: BearingView; fix: FixView }>(sweepInputSchema, {
    url: `/api/cases/${caseId}/sweeps`,
    defaultValues: { reference: 'magnetic', levelUnit: 'dBm', samples: [], oneWay: false, note: '', accuracyConfirmed: false, frequencyKhz: defaultFrequencyKhz },
    errorFields: ERROR_FIELDS,
    onSaved: () => onSaved(),
  });
  const { watch, setValue } = methods;

  const unit = watch('levelUnit') ?? 'dBm';
  const frequencyKhz = watch('frequencyKhz');
  const samples = watch('samples');
  const reference = watch('reference');
  const lat = watch('lat');
  const lon = watch('lon');
  const position = typeof lat === 'number' && typeof lon === 'number' ? { lat, lon } : null;

  // Readings in dBm for the plot and the preview fit (S-units by the IARU Region 1 scale).
  const readings = useMemo(() => {
    const hz = typeof frequencyKhz === 'number' && frequencyKhz > 0 ? frequencyKhz * 1000 : DEFAULT_S_METER_HZ;
    return (samples ?? [])
      .filter((s) => typeof s?.azimuthDeg === 'number' && typeof s?.level === 'number' && Number.isFinite(s.azimuthDeg) && Number.isFinite(s.level))
      .map((s) => ({ azimuthDeg: s.azimuthDeg, levelDbm: unit === 'S' ? sUnitsToDbm(s.level, 0, hz) : s.level }));
  }, [samples, unit, frequencyKhz]);
  const fit = useMemo(() => (readings.length >= 4 ? fitNullSweep(readings) : null), [readings]);
  const okFit = fit && fit.ok ? fit : null;

  if (!caseDetail.can.hunt) return <NoHuntRights />;

  return (
    <FormProvider {...methods}>
      <form noValidate aria-label="Add a sweep" className="space-y-4" onSubmit={submit}>
        <PositionField caseId={caseId} maxAccuracyM={caseDetail.maxPositionAccuracyM} selectedPosition={selectedPosition} mapCenter={caseDetail.reportedPosition} />
        <ReferenceField legend="Loop angles measured from" />
        <ChoiceButtons
          legend="Levels in"
          name="levelUnit"
          options={UNITS}
          value={unit}
          hint={unit === 'S' ? 'S9 + 20 dB is typed 9+20. S-units follow the IARU Region 1 scale (6 dB each).' : undefined}
          onChange={(u) => {
            setValue('levelUnit', u, { shouldDirty: true });
            // Angles stay; levels typed in the other unit are cleared to be read again.
            setValue('samples', (samples ?? []).map((r) => ({ azimuthDeg: r?.azimuthDeg, level: undefined }) as unknown as In['samples'][number]));
          }}
        />
        <SweepReadingsTable key={unit} />
        <section aria-label="Sweep fit" className="space-y-2">
          <SweepPolarPlot samples={readings} fit={okFit} referenceLabel={reference} />
          <p className="text-base font-semibold" aria-live="polite" data-testid="sweep-fit">
            {okFit
              ? `Null at ${okFit.nullAzimuthDeg.toFixed(1)}° / ${(okFit.nullAzimuthDeg + 180).toFixed(1)}° (${reference}), ±${okFit.sigmaDeg.toFixed(1)}° (1-sigma), depth ${okFit.nullDepthDb.toFixed(0)} dB, rms misfit ${okFit.rmsResidualDb.toFixed(1)} dB.`
              : fit && !fit.ok
                ? fit.message
                : 'Enter at least four readings, most of them near the null, to see the fit.'}
          </p>
          {okFit && <TrueAzimuthPreview azimuthDeg={okFit.nullAzimuthDeg} reference={reference} position={position} what="The bearing will be" />}
        </section>
        <FormTail idPrefix="sweep" problem={problem} pending={pending} onConfirm={() => void resend({ accuracyConfirmed: true })} saveLabel="Save sweep" />
      </form>
    </FormProvider>
  );
}
