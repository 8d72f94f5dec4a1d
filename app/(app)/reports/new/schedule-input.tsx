'use client';

import { useFormContext } from 'react-hook-form';
import { WEEKDAYS, type ReportInput } from '@/lib/validation/cases';
import { TextField } from '@/components/ui/text-field';
import { numberOrUndefined } from '@/components/ui/field-error';
import { ChoiceChip, SelectField } from '@/components/ui/form-fields';
import { dayName } from '@/lib/hunt/words';

const hourOption = (h: number) => ({ value: h, label: `${String(h).padStart(2, '0')}:00` });
const FROM_HOURS = Array.from({ length: 24 }, (_, h) => hourOption(h));
const TO_HOURS = Array.from({ length: 24 }, (_, h) => hourOption(h + 1));
const HOUR_FIELDS = [
  { key: 'fromHour', label: 'From', options: FROM_HOURS },
  { key: 'toHour', label: 'To', options: TO_HOURS },
] as const;
const PATTERNS = [
  { value: 'intermittent', label: 'Comes and goes' },
  { value: 'continuous', label: 'All the time' },
] as const;

/** When the noise is heard: days, hours, continuous or not, and a note. */
export function ScheduleInput() {
  const { register, formState } = useFormContext<ReportInput>();
  const e = formState.errors.schedule;
  return (
    <fieldset className="space-y-3">
      <legend className="label text-base">When do you hear it?</legend>
      <div>
        <p id="days-label" className="mb-1 text-sm text-ink-soft">
          Days (leave all off for “any day”)
        </p>
        <div className="flex flex-wrap gap-2" role="group" aria-labelledby="days-label">
          {WEEKDAYS.map((d) => (
            <label key={d} className="cursor-pointer">
              <input type="checkbox" value={d} className="peer sr-only" {...register('schedule.days')} />
              <span className="flex min-h-11 min-w-11 items-center justify-center rounded-full border border-ink/30 bg-white px-3 font-semibold peer-checked:border-hush-700 peer-checked:bg-hush-700 peer-checked:text-white peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-flare-500">
                {dayName(d)}
              </span>
            </label>
          ))}
        </div>
      </div>
      <div className="flex flex-wrap gap-3">
        {HOUR_FIELDS.map((h) => (
          <SelectField
            key={h.key}
            id={`schedule-${h.key}`}
            label={h.label}
            className="w-32"
            placeholder="any time"
            options={h.options}
            error={e?.[h.key]?.message}
            registration={register(`schedule.${h.key}`, { setValueAs: numberOrUndefined })}
          />
        ))}
      </div>
      <div className="flex flex-wrap gap-2" role="radiogroup" aria-label="Pattern">
        {PATTERNS.map((p) => (
          <ChoiceChip key={p.value} value={p.value} {...register('schedule.pattern')}>
            {p.label}
          </ChoiceChip>
        ))}
      </div>
      <TextField id="schedule-note" label="Anything else about when? (optional)" placeholder="e.g. worse on sunny afternoons" error={e?.note} registration={register('schedule.note')} />
    </fieldset>
  );
}
