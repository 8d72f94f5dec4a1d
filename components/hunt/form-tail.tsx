'use client';

import { NoteField, OneWayField } from './common-bearing-fields';
import { SaveBar } from './form-sheet-parts';
import { FrequencyField } from './frequency-field';
import { SubmitFeedback } from './submit-feedback';
import type { SubmitState } from './use-hunt-submit';

/** The end every hunt form shares: frequency, one-way, note, the save outcome and the save button. */
export function FormTail({ idPrefix, state, onConfirm, saveLabel }: { idPrefix: string; state: SubmitState; onConfirm: () => void; saveLabel: string }) {
  return (
    <>
      <FrequencyField id={`${idPrefix}-frequency`} />
      <OneWayField id={`${idPrefix}-one-way`} />
      <NoteField id={`${idPrefix}-note`} />
      <SubmitFeedback state={state} onConfirm={onConfirm} />
      <SaveBar label={saveLabel} pending={state.pending} />
    </>
  );
}
