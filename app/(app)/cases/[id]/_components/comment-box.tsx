'use client';

import { commentSchema } from '@/lib/validation/cases';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import { TextAreaField } from '@/components/ui/form-fields';

/** Add to the timeline; a hunter may also say the premises are confirmed on foot. */
export function CommentBox({ caseId, canConfirm, onPosted }: { caseId: string; canConfirm: boolean; onPosted: () => Promise<unknown> }) {
  const { form, submit, problem, pending } = useApiForm(commentSchema, {
    defaultValues: { text: '', premisesConfirmed: false },
    request: () => ({ url: `/api/cases/${caseId}/comments` }),
    onSuccess: async () => {
      form.reset({ text: '', premisesConfirmed: false });
      await onPosted();
    },
  });
  const { register, formState } = form;

  return (
    <form onSubmit={submit} noValidate className="space-y-3 border-t border-ink/10 pt-3" aria-label="Add a comment" data-testid="comment-box">
      <FormProblemBox problem={problem} />
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
      <button type="submit" className="btn-primary" disabled={pending}>
        {pending ? 'Posting…' : 'Post comment'}
      </button>
    </form>
  );
}
