'use client';

import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { toKhz } from '@/lib/hunt/bands';
import type { BaseFields } from './base-fields';
import { parseDecimal } from './number-text';

/** Frequencies from this many kHz up are shown in MHz at first. */
const MHZ_FROM_KHZ = 30_000;

/**
 * The frequency listened on, typed in kHz or MHz; writes frequencyKhz (kilohertz) of the
 * surrounding form. Optional.
 */
export function FrequencyField({ id }: { id: string }) {
  const { setValue, getValues, formState } = useFormContext<BaseFields>();
  const initial = getValues('frequencyKhz');
  const [unit, setUnit] = useState<'kHz' | 'MHz'>(initial !== undefined && initial >= MHZ_FROM_KHZ ? 'MHz' : 'kHz');
  const [text, setText] = useState(initial === undefined ? '' : String(unit === 'MHz' ? initial / 1000 : initial));
  const error = formState.errors.frequencyKhz;

  const update = (t: string, u: 'kHz' | 'MHz') => {
    setText(t);
    setUnit(u);
    const v = parseDecimal(t);
    setValue('frequencyKhz', v === undefined ? undefined : toKhz(v, u), { shouldValidate: formState.isSubmitted, shouldDirty: true });
  };

  return (
    <div>
      <label htmlFor={id} className="label">
        Frequency (optional)
      </label>
      <div className="flex gap-2">
        <input
          id={id}
          className="field flex-1"
          inputMode="decimal"
          autoComplete="off"
          value={text}
          onChange={(e) => update(e.target.value, unit)}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : undefined}
        />
        <select aria-label="Frequency unit" className="field w-24" value={unit} onChange={(e) => update(text, e.target.value as 'kHz' | 'MHz')}>
          <option value="kHz">kHz</option>
          <option value="MHz">MHz</option>
        </select>
      </div>
      {error && (
        <p id={`${id}-error`} className="mt-1 text-sm font-semibold text-alarm-600">
          {error.message}
        </p>
      )}
    </div>
  );
}
