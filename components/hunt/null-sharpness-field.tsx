'use client';

import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { NULL_SIGMA_PRESETS_DEG, nullWidthToSigmaDeg } from '@/lib/df';
import type { BearingInput } from '@/lib/validation/bearings';
import { NULL_QUALITY } from '@/lib/validation/bearings';
import { ChoiceButtons } from './choice-buttons';
import { parseDecimal } from './number-text';

const QUALITY_OPTIONS = NULL_QUALITY.map((q) => ({ value: q, label: q[0].toUpperCase() + q.slice(1), detail: `±${NULL_SIGMA_PRESETS_DEG[q]}°` }));

/**
 * How sure the bearing is (its 1-sigma, degrees): sharp / fair / broad, or the measured width of
 * the null. Writes quality or nullWidthDeg of the bearing form (never both).
 */
export function NullSharpnessField() {
  const { register, setValue, watch, formState } = useFormContext<BearingInput>();
  const [measured, setMeasured] = useState(false);
  const width = watch('nullWidthDeg');
  const sigma = typeof width === 'number' ? nullWidthToSigmaDeg(width) : NaN;
  const error = formState.errors.nullWidthDeg ?? formState.errors.quality ?? formState.errors.sigmaDeg;

  const chooseMeasured = (on: boolean) => {
    setMeasured(on);
    if (on) setValue('quality', undefined);
    else {
      setValue('nullWidthDeg', undefined);
      setValue('quality', 'fair');
    }
  };

  return (
    <div className="space-y-2">
      {!measured && (
        <ChoiceButtons legend="How sharp was the null?" name="quality" options={QUALITY_OPTIONS} value={watch('quality')} onChange={(q) => setValue('quality', q, { shouldDirty: true })} />
      )}
      <label className="flex min-h-11 items-center gap-3 font-semibold">
        <input type="checkbox" className="h-6 w-6 accent-hush-700" checked={measured} onChange={(e) => chooseMeasured(e.target.checked)} />I measured the null width
      </label>
      {measured && (
        <div>
          <label htmlFor="null-width" className="label">
            Null width (degrees)
          </label>
          <input
            id="null-width"
            className="field"
            inputMode="decimal"
            autoComplete="off"
            aria-invalid={!!formState.errors.nullWidthDeg}
            aria-describedby="null-width-hint"
            {...register('nullWidthDeg', { setValueAs: parseDecimal })}
          />
          <p id="null-width-hint" className="mt-1 text-sm text-ink-soft">
            Half the width over which the level stays within a few dB of the null is a fair 1-sigma
            {Number.isFinite(sigma) ? `: ±${sigma.toFixed(1)}°.` : '.'}
          </p>
        </div>
      )}
      {error && <p className="text-sm font-semibold text-alarm-600">{error.message}</p>}
    </div>
  );
}
