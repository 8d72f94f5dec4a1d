'use client';

import { useFormContext, useWatch } from 'react-hook-form';
import { dbmToSUnits, sUnitsToDbm } from '@/lib/df';
import { toKhz } from '@/lib/hunt/bands';
import type { ReportInput } from '@/lib/validation/cases';
import { numberOrUndefined, plainMessage } from '@/components/ui/field-error';
import { ChoiceChip, NumberField, SelectField } from '@/components/ui/form-fields';
import { signed } from '@/lib/hunt/words';

type Mode = 'none' | 'S' | 'dBm';
const MODES: { value: Mode; label: string }[] = [
  { value: 'none', label: 'Not measured' },
  { value: 'S', label: 'S-meter reading' },
  { value: 'dBm', label: 'dBm' },
];
const S_UNITS = Array.from({ length: 10 }, (_, s) => ({ value: s, label: `S${s}` }));

/** How strong the noise is: an S-meter reading or dBm, previewed as the dBm we store. */
export function LevelInput() {
  const { control, register, setValue, formState } = useFormContext<ReportInput>();
  const level = useWatch({ control, name: 'level' });
  const firstFrequency = useWatch({ control, name: 'frequencies.0' });
  const mode: Mode = level?.unit ?? 'none';
  const firstKhz = firstFrequency && typeof firstFrequency.value === 'number' && firstFrequency.value > 0 ? toKhz(firstFrequency.value, firstFrequency.unit) : undefined;
  const hz = (firstKhz ?? 10_000) * 1000;
  const errors = formState.errors.level as Record<string, { type?: unknown; message?: string } | undefined> | undefined;

  function choose(next: Mode) {
    if (next === 'none') setValue('level', undefined);
    else if (next === 'S') setValue('level', { unit: 'S', sUnits: undefined as unknown as number, overDb: 0 });
    else setValue('level', { unit: 'dBm', dbm: undefined as unknown as number });
  }

  let preview: string | null = null;
  if (level?.unit === 'S' && typeof level.sUnits === 'number' && Number.isFinite(level.sUnits)) {
    const dbm = sUnitsToDbm(level.sUnits, typeof level.overDb === 'number' && Number.isFinite(level.overDb) ? level.overDb : 0, hz);
    preview = `= ${signed(dbm)} dBm`;
  } else if (level?.unit === 'dBm' && typeof level.dbm === 'number' && Number.isFinite(level.dbm)) {
    preview = `≈ ${dbmToSUnits(level.dbm, hz).label}`;
  }

  return (
    <fieldset className="space-y-3">
      <legend className="label text-base">
        How strong is it? <span className="font-normal text-ink-soft">(optional)</span>
      </legend>
      <div className="flex flex-wrap gap-2" role="radiogroup" aria-label="How you measured the level">
        {MODES.map((m) => (
          <ChoiceChip key={m.value} name="level-mode" value={m.value} checked={mode === m.value} onChange={() => choose(m.value)}>
            {m.label}
          </ChoiceChip>
        ))}
      </div>
      {mode === 'S' && (
        <div className="flex flex-wrap items-start gap-3">
          <SelectField
            id="level-s"
            label="S-meter"
            className="w-32"
            placeholder="choose…"
            options={S_UNITS}
            error={plainMessage(errors?.sUnits, 'Choose the S-meter reading.')}
            registration={register('level.sUnits', { setValueAs: numberOrUndefined })}
          />
          <NumberField
            id="level-over"
            label="+ dB over S9"
            className="w-40"
            min={0}
            max={80}
            placeholder="0"
            hint="Only when the needle goes past S9."
            error={plainMessage(errors?.overDb, 'Type the dB over S9 (0 to 80), or leave it empty.')}
            registration={register('level.overDb', { setValueAs: numberOrUndefined })}
          />
        </div>
      )}
      {mode === 'dBm' && (
        <NumberField
          id="level-dbm"
          label="Level in dBm"
          className="w-48"
          min={-170}
          max={0}
          placeholder="e.g. -95"
          error={plainMessage(errors?.dbm, 'Type the level in dBm, e.g. −95 (between −170 and 0).')}
          registration={register('level.dbm', { setValueAs: numberOrUndefined })}
        />
      )}
      {mode !== 'none' && (
        <div className="text-sm text-ink-soft">
          <p aria-live="polite" className="text-base font-semibold text-ink" data-testid="level-preview">
            {preview ?? '\u00a0'}
          </p>
          <p>
            Stored as dBm (IARU Region 1: S9 = −73 dBm below 30 MHz
            {firstKhz === undefined ? '; until you type a frequency we assume below 30 MHz' : firstKhz >= 30_000 ? ', −93 dBm from 30 MHz up, as for your first frequency' : ''}).
          </p>
        </div>
      )}
    </fieldset>
  );
}
