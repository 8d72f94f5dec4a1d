'use client';

import { OUTCOMES } from '@/lib/validation/cases';
import { numberOrUndefined, plainMessage } from '@/components/ui/field-error';
import { NumberField, SelectField, TextAreaField } from '@/components/ui/form-fields';
import { TransitionFormShell } from './transition-form-shell';
import { resolvedSchema } from './transition-schemas';
import { useTransitionForm, type TransitionFormProps } from './use-transition-form';

const OUTCOME_OPTIONS = Object.entries(OUTCOMES).map(([value, label]) => ({ value, label }));

export function ResolveForm({ c, onDone, onCancel }: TransitionFormProps) {
  const { form, submit, problem, pending } = useTransitionForm(
    resolvedSchema,
    { to: 'resolved', version: c.version, outcome: undefined as never, levelBeforeDbm: c.report.levelDbm ?? undefined, note: '' },
    { c, onDone },
  );
  const { register, formState } = form;
  const levelError = (key: 'levelBeforeDbm' | 'levelAfterDbm') => plainMessage(formState.errors[key], 'A level in dBm between −170 and 0, or leave it empty.');
  return (
    <TransitionFormShell title="Close with an outcome" submitLabel="Resolve the case" busy={pending} problem={problem} onSubmit={submit} onCancel={onCancel}>
      <SelectField
        id="resolve-outcome"
        label="Outcome"
        placeholder="choose…"
        options={OUTCOME_OPTIONS}
        error={plainMessage(formState.errors.outcome, 'Choose an outcome.')}
        registration={register('outcome')}
      />
      <p className="text-sm text-ink-soft">Levels where measured, in dBm at the reporter’s receiver (leave empty if not measured).</p>
      <div className="grid gap-3 sm:grid-cols-2">
        {(['levelBeforeDbm', 'levelAfterDbm'] as const).map((key) => (
          <NumberField
            key={key}
            id={`resolve-${key}`}
            label={key === 'levelBeforeDbm' ? 'Level before (dBm)' : 'Level after (dBm)'}
            min={-170}
            max={0}
            error={levelError(key)}
            registration={register(key, { setValueAs: numberOrUndefined })}
          />
        ))}
      </div>
      <TextAreaField id="resolve-note" label="Note (optional)" registration={register('note')} error={formState.errors.note?.message} />
    </TransitionFormShell>
  );
}
