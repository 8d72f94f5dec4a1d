'use client';

import { NoticeBox } from '@/components/ui/notice-box';
import { FormProblemBox } from '@/components/ui/form-problem';
import type { FormProblem } from '@/lib/api/use-api-form';

/** The outcome of a save: the failure message, or the coarse-position question with "Use it anyway". */
export function SubmitFeedback({ problem, pending, onConfirm }: { problem: FormProblem | null; pending: boolean; onConfirm: () => void }) {
  if (problem?.code !== 'accuracy-unconfirmed') return <FormProblemBox problem={problem} />;
  return (
    <div className="space-y-2">
      <NoticeBox tone="warn" title="Position less accurate than the club’s limit">
        {problem.message}
      </NoticeBox>
      <button type="button" className="btn-quiet w-full border-flare-500" onClick={onConfirm} disabled={pending}>
        Use it anyway
      </button>
    </div>
  );
}
