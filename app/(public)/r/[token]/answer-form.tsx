'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useApiForm } from '@/lib/api/use-api-form';
import { NoticeBox } from '@/components/ui/notice-box';
import { FormProblemBox } from '@/components/ui/form-problem';
import { ANSWER_KINDS, answerSchema } from '@/lib/validation/notices';

export function AnswerForm({ token }: { token: string }) {
  const router = useRouter();
  const [done, setDone] = useState<string | null>(null);
  const { form, submit, problem } = useApiForm<typeof answerSchema, { message: string }>(answerSchema, {
    defaultValues: { kind: undefined, message: '', contact: '' },
    request: () => ({ url: `/api/r/${encodeURIComponent(token)}/answers` }),
    // The answer's paths are its own fields (kind, message, contact) even while they are empty.
    fieldFor: (p) => (['kind', 'message', 'contact'].includes(p) ? p : null),
    onSuccess: (data) => {
      setDone(data.message);
      form.reset({ kind: undefined, message: '', contact: '' });
      router.refresh();
    },
  });
  const { register, watch, formState } = form;
  const kind = watch('kind');

  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      {done && <NoticeBox title="Answer sent">{done}</NoticeBox>}
      <FormProblemBox problem={problem} />
      <fieldset className="space-y-2" aria-describedby={formState.errors.kind ? 'kind-error' : undefined}>
        <legend className="label">What would you like to tell the club?</legend>
        {Object.entries(ANSWER_KINDS).map(([value, label]) => (
          <label key={value} className="flex min-h-11 items-center gap-3 rounded-md border border-ink/15 px-3 py-2">
            <input type="radio" value={value} {...register('kind')} className="h-5 w-5" />
            <span>{label}</span>
          </label>
        ))}
        {formState.errors.kind && (
          <p id="kind-error" className="text-sm font-semibold text-alarm-600">
            {formState.errors.kind.message}
          </p>
        )}
      </fieldset>
      {kind === 'contact-me' && (
        <div>
          <label htmlFor="answer-contact" className="label">
            How can we reach you?
          </label>
          <input id="answer-contact" className="field" autoComplete="tel" aria-invalid={!!formState.errors.contact} aria-describedby="answer-contact-hint" {...register('contact')} />
          <p id="answer-contact-hint" className="mt-1 text-sm text-ink-soft">
            A phone number or e-mail address, and a good time to call.
          </p>
          {formState.errors.contact && <p className="mt-1 text-sm font-semibold text-alarm-600">{formState.errors.contact.message}</p>}
        </div>
      )}
      <div>
        <label htmlFor="answer-message" className="label">
          Anything else? (optional)
        </label>
        <textarea id="answer-message" rows={4} className="field" aria-invalid={!!formState.errors.message} {...register('message')} />
        {formState.errors.message && <p className="mt-1 text-sm font-semibold text-alarm-600">{formState.errors.message.message}</p>}
      </div>
      <button type="submit" className="btn-primary w-full sm:w-auto" disabled={formState.isSubmitting}>
        Send my answer
      </button>
    </form>
  );
}
