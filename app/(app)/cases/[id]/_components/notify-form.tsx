'use client';

import { TextField } from '@/components/ui/text-field';
import { TransitionFormShell } from './transition-form-shell';
import { TextAreaField } from '@/components/ui/form-fields';
import { notifiedSchema } from './transition-schemas';
import { useTransitionForm, type TransitionFormProps } from './use-transition-form';

/** Today as YYYY-MM-DD in the browser's own time zone. */
const today = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

export function NotifyForm({ c, onDone, onCancel }: TransitionFormProps) {
  const { form, submit, problem, pending } = useTransitionForm(notifiedSchema, { to: 'notified', version: c.version, method: 'hand-delivered', deliveredOn: today(), note: '' }, { c, onDone });
  const { register, formState } = form;
  return (
    <TransitionFormShell title="Hand-delivered letter" submitLabel="Record as delivered" busy={pending} problem={problem} onSubmit={submit} onCancel={onCancel}>
      <p className="text-sm text-ink-soft">Record a printed letter that someone from the committee put through the neighbour’s door.</p>
      <TextField id="delivered-on" type="date" max={today()} label="Delivered on" error={formState.errors.deliveredOn} registration={register('deliveredOn')} />
      <TextAreaField id="notify-note" label="Note (optional)" registration={register('note')} error={formState.errors.note?.message} />
    </TransitionFormShell>
  );
}
