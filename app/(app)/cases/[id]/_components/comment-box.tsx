'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { commentSchema } from '@/lib/validation/cases';
import { callApi } from '@/lib/api/client';
import type { EventView } from '@/lib/hunt/views';
import { NoticeBox } from '@/components/ui/notice-box';
import { applyServerIssues } from '@/lib/api/apply-server-issues';
import { TextAreaField } from '@/components/ui/form-fields';

type CommentIn = z.input<typeof commentSchema>;
type CommentOut = z.output<typeof commentSchema>;

/** Add to the timeline; a hunter may also say the premises are confirmed on foot. */
export function CommentBox({ caseId, canConfirm, onPosted }: { caseId: string; canConfirm: boolean; onPosted: () => Promise<unknown> }) {
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<CommentIn, unknown, CommentOut>({
    resolver: zodResolver(commentSchema),
    defaultValues: { text: '', premisesConfirmed: false },
  });

  async function onSubmit(values: CommentOut) {
    setProblem(null);
    const r = await callApi<EventView>(`/api/cases/${caseId}/comments`, { body: values });
    if (r.ok) {
      reset({ text: '', premisesConfirmed: false });
      await onPosted();
    } else {
      const rest = applyServerIssues(r.issues, setError, (p) => p === 'text' || p === 'premisesConfirmed');
      setProblem([r.error, ...rest].join(' '));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-3 border-t border-ink/10 pt-3" aria-label="Add a comment" data-testid="comment-box">
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <TextAreaField id="comment-text" label="Add a comment" rows={3} registration={register('text')} error={formState.errors.text?.message} />
      {canConfirm && (
        <div>
          <label className="flex min-h-11 cursor-pointer items-start gap-3">
            <input type="checkbox" className="mt-1 h-5 w-5 shrink-0 accent-hush-700" aria-describedby="premises-hint" {...register('premisesConfirmed')} />
            <span className="font-semibold">I confirmed the premises on foot</span>
          </label>
          <p id="premises-hint" className="ml-8 text-sm text-ink-soft">
            Only from public ground, by the level peaking at one address. Never go onto the property or speak to anyone about it.
          </p>
        </div>
      )}
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Posting…' : 'Post comment'}
      </button>
    </form>
  );
}
