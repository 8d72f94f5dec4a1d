'use client';

import { useFormContext } from 'react-hook-form';
import { SOUND_KINDS, type ReportInput } from '@/lib/validation/cases';
import { FieldError, plainMessage } from '@/components/ui/field-error';
import { ChoiceChip, TextAreaField } from '@/components/ui/form-fields';

/** What the noise sounds like: one card per kind, plus the reporter's own words. */
export function SoundChoice() {
  const { register, formState } = useFormContext<ReportInput>();
  const soundError = plainMessage(formState.errors.sound, 'Choose what it sounds like.');
  return (
    <fieldset className="space-y-3" aria-describedby={soundError ? 'sound-error' : undefined}>
      <legend className="label text-base">What does it sound like?</legend>
      <div className="grid gap-2 sm:grid-cols-2">
        {Object.entries(SOUND_KINDS).map(([value, text]) => (
          <ChoiceChip key={value} value={value} aria-invalid={!!soundError} className="has-[:checked]:font-semibold" {...register('sound')}>
            {text}
          </ChoiceChip>
        ))}
      </div>
      <FieldError id="sound-error" message={soundError} />
      <TextAreaField
        id="soundNote"
        label={
          <>
            In your own words <span className="font-normal text-ink-soft">(needed for “something else”)</span>
          </>
        }
        placeholder="e.g. a buzz that comes and goes every few seconds"
        error={formState.errors.soundNote?.message}
        registration={register('soundNote')}
      />
    </fieldset>
  );
}
