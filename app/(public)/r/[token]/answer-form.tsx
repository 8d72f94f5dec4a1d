'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { callApi } from '@/lib/api/client';
import { NoticeBox } from '@/components/ui/notice-box';
import { ANSWER_KINDS, answerSchema, type AnswerInput } from '@/lib/validation/notices';

export function AnswerForm({ token }: { token: string }) {
  const router = useRouter();
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, watch, formState, reset } = useForm<AnswerInput>({
    resolver: zodResolver(answerSchema),
    defaultValues: { kind: undefined, message: '', contact: '' },
  });
  const kind = watch('kind');

  async function onSubmit(values: AnswerInput) {
    setProblem(null);
    const r = await callApi<{ message: string }>(`/api/r/${encodeURIComponent(token)}/answers`, { body: values });
    if (!r.ok) return setProblem(r.error);
    setDone(r.data.message);
    reset({ kind: undefined, message: '', contact: '' });
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {done && <NoticeBox title="Answer sent">{done}</NoticeBox>}
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
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
