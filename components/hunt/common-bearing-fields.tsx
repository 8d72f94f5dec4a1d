'use client';

import { useEffect } from 'react';
import { useFormContext } from 'react-hook-form';
import type { BaseFields } from './base-fields';
import { ChoiceButtons } from './choice-buttons';
import { loadReference, saveReference } from './field-memory';

const REFERENCES = [
  { value: 'magnetic', label: 'Magnetic', detail: 'hand or phone compass' },
  { value: 'true', label: 'True', detail: 'map or true north' },
] as const;

/** Which north the azimuth is measured from; starts at the hunter's last choice (magnetic when unknown). */
export function ReferenceField({ legend = 'Azimuth measured from' }: { legend?: string }) {
  const { setValue, watch } = useFormContext<BaseFields>();
  useEffect(() => {
    setValue('reference', loadReference());
  }, [setValue]);
  return (
    <ChoiceButtons
      legend={legend}
      name="reference"
      options={REFERENCES}
      value={watch('reference')}
      onChange={(v) => {
        setValue('reference', v, { shouldDirty: true });
        saveReference(v);
      }}
    />
  );
}

/** One-way line: a sense antenna resolved which end of the null the source is on. */
export function OneWayField({ id }: { id: string }) {
  const { register } = useFormContext<BaseFields>();
  return (
    <div className="flex items-start gap-3">
      <input id={id} type="checkbox" className="mt-1 h-7 w-7 shrink-0 accent-hush-700" aria-describedby={`${id}-hint`} {...register('oneWay')} />
      <div>
        <label htmlFor={id} className="font-semibold">
          One-way (sense antenna used)
        </label>
        <p id={`${id}-hint`} className="text-sm text-ink-soft">
          Tick only if a sense antenna showed which side the source is on; a plain loop null points both ways.
        </p>
      </div>
    </div>
  );
}

/** Free note (what you heard, where you stood). */
export function NoteField({ id }: { id: string }) {
  const { register, formState } = useFormContext<BaseFields>();
  const error = formState.errors.note;
  return (
    <div>
      <label htmlFor={id} className="label">
        Note (optional)
      </label>
      <textarea id={id} rows={2} maxLength={1000} className="field" aria-invalid={!!error} {...register('note')} />
      {error && <p className="mt-1 text-sm font-semibold text-alarm-600">{error.message}</p>}
    </div>
  );
}
