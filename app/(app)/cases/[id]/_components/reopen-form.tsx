'use client';

import { TransitionFormShell } from './transition-form-shell';
import { TextAreaField } from '@/components/ui/form-fields';
import { reopenSchema } from './transition-schemas';
import { useTransitionForm, type TransitionFormProps } from './use-transition-form';

export function ReopenForm({ c, onDone, onCancel }: TransitionFormProps) {
  const { form, submit, problem, pending } = useTransitionForm(reopenSchema, { to: 'open', version: c.version, reason: '' }, { c, onDone });
  return (
    <TransitionFormShell title="Back to open" submitLabel="Reopen the case" busy={pending} problem={problem} onSubmit={submit} onCancel={onCancel}>
      <TextAreaField
        id="reopen-reason"
        label="Why does the case go back to open?"
        hint="e.g. the noise came back, or the fix pointed at the wrong house"
        registration={form.register('reason')}
        error={form.formState.errors.reason?.message}
      />
    </TransitionFormShell>
  );
}
