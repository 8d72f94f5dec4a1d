'use client';

import { useState } from 'react';
import { useFieldArray, useFormContext } from 'react-hook-form';
import type { SweepInput } from '@/lib/validation/bearings';
import { parseDecimal, parseLevel } from './number-text';
import { aroundRoughNull, everyTenDegrees } from './sweep-presets';

type Row = SweepInput['samples'][number];
/** A row whose level is still to be read (the input starts empty). */
const row = (azimuthDeg?: number) => ({ azimuthDeg, level: undefined }) as unknown as Row;

/** The readings of a sweep: loop axis angle and level per row, with quick ways to lay rows out. */
export function SweepReadingsTable() {
  const { control, register, getValues, formState } = useFormContext<SweepInput>();
  const { fields, append, remove, replace } = useFieldArray({ control, name: 'samples' });
  const [rough, setRough] = useState('');
  const roughDeg = parseDecimal(rough);
  const unit = getValues('levelUnit') ?? 'dBm';
  const rowErrors = formState.errors.samples;
  const listError = rowErrors?.message ?? rowErrors?.root?.message;

  return (
    <div className="space-y-3">
      <fieldset className="space-y-2">
        <legend className="label">Lay out the rows</legend>
        <button type="button" className="btn-quiet w-full" onClick={() => replace(everyTenDegrees().map(row))}>
          Every 10° from 0 to 170
        </button>
        <div className="flex items-end gap-2">
          <div className="flex-1">
            <label htmlFor="sweep-rough" className="label">
              Rough null (degrees)
            </label>
            <input id="sweep-rough" className="field" inputMode="decimal" autoComplete="off" value={rough} onChange={(e) => setRough(e.target.value)} />
          </div>
          <button
            type="button"
            className="btn-quiet"
            disabled={roughDeg === undefined || !Number.isFinite(roughDeg)}
            onClick={() => roughDeg !== undefined && replace(aroundRoughNull(roughDeg).map(row))}
          >
            7 readings ±30°
          </button>
        </div>
      </fieldset>

      <table className="w-full border-separate border-spacing-y-1">
        <caption className="sr-only">Sweep readings</caption>
        <thead>
          <tr className="text-left text-sm">
            <th scope="col" className="w-28 font-semibold">
              Loop axis °
            </th>
            <th scope="col" className="font-semibold">
              Level ({unit === 'S' ? 'S-units, e.g. 7 or 9+20' : 'dBm'})
            </th>
            <th scope="col">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {fields.map((f, i) => {
            const e = rowErrors?.[i];
            return (
              <tr key={f.id} className="align-top">
                <td className="pr-2">
                  <input
                    className="field tabular-nums"
                    inputMode="decimal"
                    autoComplete="off"
                    aria-label={`Loop axis angle, row ${i + 1}`}
                    aria-invalid={!!e?.azimuthDeg}
                    {...register(`samples.${i}.azimuthDeg`, { setValueAs: parseDecimal })}
                  />
                  {e?.azimuthDeg && <p className="text-xs font-semibold text-alarm-600">{e.azimuthDeg.message}</p>}
                </td>
                <td className="pr-2">
                  <input
                    className="field tabular-nums"
                    inputMode={unit === 'S' ? 'text' : 'decimal'}
                    autoComplete="off"
                    aria-label={`Level, row ${i + 1}`}
                    aria-invalid={!!e?.level}
                    {...register(`samples.${i}.level`, { setValueAs: (v) => parseLevel(v, getValues('levelUnit') ?? 'dBm') })}
                  />
                  {e?.level && <p className="text-xs font-semibold text-alarm-600">{e.level.message}</p>}
                </td>
                <td className="w-11">
                  <button type="button" className="btn-quiet w-11 px-0" aria-label={`Remove row ${i + 1}`} onClick={() => remove(i)}>
                    ✕
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {fields.length === 0 && <p className="text-sm text-ink-soft">No rows yet: lay them out above or add them one by one.</p>}
      {listError && <p className="text-sm font-semibold text-alarm-600">{listError}</p>}
      <button type="button" className="btn-quiet w-full" onClick={() => append(row())}>
        Add a row
      </button>
    </div>
  );
}
