'use client';

import type { z } from 'zod';
import type { DefaultValues, FieldValues } from 'react-hook-form';
import type { CaseDetail } from '@/lib/hunt/views';
import { useApiForm } from '@/lib/api/use-api-form';
import type { TransitionSchema } from './transition-schemas';

/** What every transition form gets from the status actions. */
export type TransitionFormProps = {
  c: CaseDetail;
  /** after the server moved the case (or said it changed meanwhile: 409), with a message for the card */
  onDone: (message: { tone: 'info' | 'warn'; text: string }) => Promise<unknown>;
  onCancel: () => void;
};

/**
 * A transition form: the one form hook (useApiForm) with its branch of transitionSchema, sent to
 * POST /api/cases/:id/transitions with the case version the page shows; server issues land on the
 * fields, a broken rule (422) shows in the form, a stale version (409) refreshes the page.
 */
export function useTransitionForm<S extends TransitionSchema>(schema: S, defaults: z.input<S>, { c, onDone }: Pick<TransitionFormProps, 'c' | 'onDone'>) {
  // One branch of a union: seen by the hook as a plain schema from its input to its output.
  type Branch = z.ZodType<z.output<S>, z.input<S>>;
  return useApiForm<Branch>(schema as unknown as Branch, {
    defaultValues: defaults as DefaultValues<z.input<S> & FieldValues>,
    request: (values) => ({ url: `/api/cases/${c.id}/transitions`, body: { ...(values as object), version: c.version } }),
    onSuccess: (_data, values) => onDone({ tone: 'info', text: `The case is now ${(values as { to: string }).to}.` }),
    onFailure: async (r) => {
      if (r.status === 409) await onDone({ tone: 'warn', text: `${r.error} The page now shows the latest version; check it and try again.` });
    },
  });
}
