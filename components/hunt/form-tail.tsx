'use client';

import { NoteField, OneWayField } from './common-bearing-fields';
import { SaveBar } from './form-sheet-parts';
import { FrequencyField } from './frequency-field';
import { SubmitFeedback } from './submit-feedback';
import type { FormProblem } from '@/lib/api/use-api-form';

/** The end every hunt form shares: frequency, one-way, note, the save outcome and the save button. */
export function FormTail(p: { idPrefix: string; problem: FormProblem | null; pending: boolean; onConfirm: () => void; saveLabel: string }) {
  const { idPrefix, saveLabel } = p;
  return (
    <>
      <FrequencyField id={`${idPrefix}-frequency`} />
      <OneWayField id={`${idPrefix}-one-way`} />
      <NoteField id={`${idPrefix}-note`} />
      <SubmitFeedback problem={p.problem} pending={p.pending} onConfirm={p.onConfirm} />
      <SaveBar label={saveLabel} pending={p.pending} />
    </>
  );
}
