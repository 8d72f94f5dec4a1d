'use client';

import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { bandOf, toKhz } from '@/lib/hunt/bands';
import type { ReportInput } from '@/lib/validation/cases';
import { FieldError, numberOrUndefined, plainMessage } from '@/components/ui/field-error';
import { NumberField, SelectField } from '@/components/ui/form-fields';

const MAX_FREQUENCIES = 12;
const UNITS = [
  { value: 'kHz', label: 'kHz' },
  { value: 'MHz', label: 'MHz' },
];

/** "Band: 40m", or for a frequency between the amateur bands "Outside the amateur bands (9 MHz)". */
const bandWords = (name: string) => (/^\d+m$/.test(name) ? `Band: ${name}` : `Outside the amateur bands (${name})`);

type FrequencyRow = ReportInput['frequencies'][number];
/** A row with an empty number box (the schema asks for a number on submit). */
export const emptyFrequency = (unit: FrequencyRow['unit'] = 'MHz') => ({ value: undefined, unit }) as unknown as FrequencyRow;

/** Where on the dial: one row per frequency (number + kHz/MHz), each showing its band. */
export function FrequencyRows() {
  const { control, register, formState } = useFormContext<ReportInput>();
  const { fields, append, remove } = useFieldArray({ control, name: 'frequencies' });
  const values = useWatch({ control, name: 'frequencies' });
  const listError = formState.errors.frequencies?.message ?? formState.errors.frequencies?.root?.message;
  return (
    <fieldset className="space-y-2" aria-describedby={listError ? 'frequencies-error' : undefined}>
      <legend className="label text-base">Where on the dial?</legend>
      <p className="text-sm text-ink-soft">Each frequency where you hear it. Several help the hunter pick the best one.</p>
      <ul className="space-y-2">
        {fields.map((f, i) => {
          const row = values?.[i];
          const khz = row && typeof row.value === 'number' && row.value > 0 ? toKhz(row.value, row.unit) : undefined;
          const err = plainMessage(formState.errors.frequencies?.[i]?.value, 'Type a number.');
          const n = i + 1;
          return (
            <li key={f.id} className="flex flex-wrap items-start gap-2">
              <NumberField
                id={`freq-${i}`}
                label={`Frequency ${n}`}
                hideLabel
                className="min-w-0 flex-1"
                min={0}
                placeholder="e.g. 3.650"
                error={err}
                hint={
                  <span data-testid="frequency-band" className={khz !== undefined ? 'font-semibold text-hush-700' : undefined}>
                    {khz === undefined ? 'Band: type a frequency' : bandWords(bandOf(khz))}
                  </span>
                }
                registration={register(`frequencies.${i}.value`, { setValueAs: numberOrUndefined })}
              />
              <SelectField id={`freq-${i}-unit`} label={`Unit of frequency ${n}`} hideLabel className="w-24" options={UNITS} registration={register(`frequencies.${i}.unit`)} />
              <button type="button" className="btn-quiet px-3" aria-label={`Remove frequency ${n}`} disabled={fields.length === 1} onClick={() => remove(i)}>
                ✕
              </button>
            </li>
          );
        })}
      </ul>
      <FieldError id="frequencies-error" message={listError} />
      {fields.length < MAX_FREQUENCIES && (
        <button type="button" className="btn-quiet" onClick={() => append(emptyFrequency(values?.[values.length - 1]?.unit))}>
          Add another frequency
        </button>
      )}
    </fieldset>
  );
}
