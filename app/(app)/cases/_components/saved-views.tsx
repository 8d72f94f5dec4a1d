'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { callApi } from '@/lib/api/client';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import { savedFilterSchema } from '@/lib/validation/queue';

/**
 * The person's saved views of the queue: open one, save the current one under a name (the one
 * form hook: the name's problems show under it, the query's with the form), remove one.
 */
export function SavedViews({ saved, current }: { saved: { id: string; name: string; query: string }[]; current: string }) {
  const router = useRouter();
  const [removeError, setRemoveError] = useState<string | null>(null);
  const { form, submit, problem, pending } = useApiForm(savedFilterSchema, {
    defaultValues: { name: '', query: current },
    // The query is whatever the queue shows now, not what it showed when the form was made.
    request: (v) => ({ url: '/api/saved-filters', body: { name: v.name, query: current } }),
    onSuccess: () => {
      form.reset({ name: '', query: current });
      router.refresh();
    },
  });
  const nameError = form.formState.errors.name?.message;
  const name = form.watch('name');
  async function remove(id: string) {
    const r = await callApi(`/api/saved-filters/${id}`, { method: 'DELETE' });
    setRemoveError(r.ok ? null : r.error);
    if (r.ok) router.refresh();
  }
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm" aria-label="Saved views">
      <span className="font-semibold">Saved views:</span>
      {saved.length === 0 && <span className="text-ink-faint">none yet</span>}
      {saved.map((s) => (
        <span key={s.id} className="inline-flex items-center gap-1 rounded-full border border-ink/20 bg-white px-2 py-0.5">
          <Link href={`/cases${s.query ? `?${s.query}` : ''}`}>{s.name}</Link>
          <button type="button" aria-label={`Remove the view ${s.name}`} onClick={() => remove(s.id)} className="text-ink-faint">
            ×
          </button>
        </span>
      ))}
      <form
        className="inline-flex flex-wrap items-center gap-2"
        aria-label="Save this view"
        noValidate
        onSubmit={(e) => {
          form.setValue('query', current);
          return submit(e);
        }}
      >
        <label htmlFor="view-name" className="sr-only">Name for this view</label>
        <input
          id="view-name"
          className="field w-40"
          placeholder="name this view"
          aria-invalid={!!nameError}
          aria-describedby={nameError ? 'view-name-error' : undefined}
          {...form.register('name')}
        />
        <button type="submit" className="btn-quiet" disabled={pending || !name?.trim()}>
          Save view
        </button>
        {nameError && (
          <span id="view-name-error" role="alert" className="font-semibold text-alarm-600">
            {nameError}
          </span>
        )}
      </form>
      <FormProblemBox problem={problem} />
      {removeError && <span role="alert" className="text-alarm-600">{removeError}</span>}
    </div>
  );
}
