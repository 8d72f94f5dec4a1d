'use client';

import type { FixView } from '@/lib/hunt/views';
import { FieldError } from '@/components/ui/field-error';
import { ChoiceChip, TextAreaField } from '@/components/ui/form-fields';
import { TransitionFormShell } from './transition-form-shell';
import { locatedSchema } from './transition-schemas';
import { useTransitionForm, type TransitionFormProps } from './use-transition-form';
import { metres } from '@/lib/hunt/words';

/** How the current fix compares with the club's limit, in words. */
function fixAgainstLimit(fix: FixView | undefined, limitM: number): string {
  const f = fix?.current?.fix;
  if (!f) return 'There is no fix yet.';
  if (!f.ok) return `There is no usable fix: ${f.message}`;
  const m = f.ellipse.semiMajorM;
  return `Error ellipse semi-major ${metres(m)} against the club’s limit of ${metres(limitM)}: ${m <= limitM ? 'small enough' : 'too large'}.`;
}

export function LocateForm({ c, fix, onDone, onCancel }: TransitionFormProps & { fix?: FixView }) {
  const { form, submit, problem, pending } = useTransitionForm(locatedSchema, { to: 'located', version: c.version, evidence: fix?.locatable === false ? 'premises' : 'fix', note: '' }, { c, onDone });
  const { register, formState } = form;
  const evidence = [
    { value: 'fix', title: 'The current fix', text: fixAgainstLimit(fix, c.locateThresholdM) },
    { value: 'premises', title: 'Premises confirmed by the hunter', text: 'The hunter walked past on public ground and the level peaked at one address.' },
  ];
  return (
    <TransitionFormShell title="Mark as located" submitLabel="Mark as located" busy={pending} problem={problem} onSubmit={submit} onCancel={onCancel}>
      <fieldset className="space-y-2" aria-describedby={formState.errors.evidence ? 'evidence-error' : undefined}>
        <legend className="label">What shows where the source is?</legend>
        {evidence.map((e) => (
          <ChoiceChip key={e.value} value={e.value} {...register('evidence')}>
            <span>
              <span className="block font-semibold">{e.title}</span>
              <span className="block text-sm text-ink-soft" data-testid={`locate-evidence-${e.value}`}>
                {e.text}
              </span>
            </span>
          </ChoiceChip>
        ))}
        <FieldError id="evidence-error" message={formState.errors.evidence?.message} />
      </fieldset>
      <TextAreaField id="locate-note" label="Note (optional)" registration={register('note')} error={formState.errors.note?.message} />
    </TransitionFormShell>
  );
}
