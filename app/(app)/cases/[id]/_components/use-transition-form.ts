'use client';

import { useForm, type DefaultValues, type FieldValues, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import type { ApiResult } from '@/lib/api/client';
import type { CaseDetail } from '@/lib/hunt/views';
import { applyServerIssues } from '@/lib/api/apply-server-issues';
import type { TransitionBody, TransitionSchema } from './transition-schemas';

export type SendTransition = (body: TransitionBody) => Promise<ApiResult<unknown>>;

/** What every transition form gets from the status actions. */
export type TransitionFormProps = { c: CaseDetail; send: SendTransition; busy: boolean; onCancel: () => void };

/** A transition form: validated by its branch of transitionSchema; server issues land on the fields. */
export function useTransitionForm<S extends TransitionSchema>(schema: S, defaults: z.input<S>, send: SendTransition) {
  type In = z.input<S> & FieldValues;
  type Out = z.output<S> & TransitionBody;
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(schema as never) as unknown as Resolver<In, unknown, Out>,
    defaultValues: defaults as DefaultValues<In>,
  });
  const submit = form.handleSubmit(async (values) => {
    const r = await send(values);
    if (!r.ok) applyServerIssues(r.issues, form.setError, (p) => p in schema.shape);
  });
  return { form, submit };
}
