'use client';

import { NoticeBox } from '@/components/ui/notice-box';
import type { SubmitState } from './use-hunt-submit';

/** The outcome of a save: the failure message, or the coarse-position question with "Use it anyway". */
export function SubmitFeedback({ state, onConfirm }: { state: SubmitState; onConfirm: () => void }) {
  return (
    <>
      {state.error && <NoticeBox tone="error">{state.error}</NoticeBox>}
      {state.confirm && (
        <div className="space-y-2">
          <NoticeBox tone="warn" title="Position less accurate than the club’s limit">
            {state.confirm.message}
          </NoticeBox>
          <button type="button" className="btn-quiet w-full border-flare-500" onClick={onConfirm} disabled={state.pending}>
            Use it anyway
          </button>
        </div>
      )}
    </>
  );
}
