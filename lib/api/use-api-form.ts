'use client';

import { useRef, useState } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path, type Resolver, type UseFormReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { holdAfterFailedSend } from '@/lib/field/drain';
import { browserOffline, callApi, type ApiResult } from './client';

/** What the form shows above its button when the server said no: its message and the issues no field took. */
export type FormProblem = { status: number; message: string; code?: string; body?: Record<string, unknown> };

export type ApiRequest = { url: string; method?: string; body?: unknown };

export type ApiFormOptions<In extends FieldValues, Out, T> = {
  defaultValues: DefaultValues<In>;
  /** The request for validated values (default body: the values themselves). */
  request: (values: Out) => ApiRequest;
  /** After a 2xx answer (reset the form, refresh data, say thanks...). */
  onSuccess?: (data: T, values: Out) => unknown;
  /** After any other answer, once the issues are placed (e.g. refresh after a 409). */
  onFailure?: (r: Extract<ApiResult<T>, { ok: false }>) => unknown;
  /**
   * The form field that shows a server issue at `path` ("samples.2.level"), or null to show it
   * with the general message. Default: the path itself when the form has a value there or the
   * schema a top-level key of that name.
   */
  fieldFor?: (path: string) => string | null;
  /** Plain words for generic zod issues (zodResolver's `error` option). */
  errorMap?: z.core.$ZodErrorMap;
  /**
   * The phone's offline queue (the field screen gives one): every send then carries a new
   * `clientId`, and when there is no connection (or the answer is one the queue retries: 5xx,
   * 401, 408, 429 — lib/field/drain.ts `holdAfterFailedSend`) the request is handed to `hold`
   * instead of failing, and `onHeld` runs.
   */
  hold?: ((url: string, body: Record<string, unknown> & { clientId: string }) => Promise<void>) | null;
  onHeld?: (values: Out) => unknown;
};

/** An answer that never came back because the request was kept on the phone to be sent later. */
export const HELD: { ok: false; status: 0; error: string; body: { held: true } } = {
  ok: false,
  status: 0,
  error: 'Kept on this phone: it is sent when the connection returns.',
  body: { held: true },
};

/** The value at a dotted path ("samples.2.level") of the form's values, or undefined. */
function valueAt(values: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((v, k) => (v && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), values);
}

/**
 * The one way a form talks to a route handler: react-hook-form validated by the same zod schema
 * as the handler, then `callApi`; a 400's `issues` go onto the fields they name and whatever no
 * field takes (and every other failure) becomes `problem`, which <FormProblemBox> shows.
 * `resend(extra)` sends the last values again with something added (e.g. accuracyConfirmed).
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any schema; In and Out come from it
export function useApiForm<S extends z.ZodType<any, any, any>, T = unknown>(
  schema: S,
  opts: ApiFormOptions<z.input<S> & FieldValues, z.output<S>, T>,
): {
  form: UseFormReturn<z.input<S> & FieldValues, unknown, z.output<S>>;
  submit: (e?: React.BaseSyntheticEvent) => Promise<void>;
  resend: (extra: Record<string, unknown>) => Promise<ApiResult<T> | undefined>;
  problem: FormProblem | null;
  setProblem: (p: FormProblem | null) => void;
  pending: boolean;
} {
  type In = z.input<S> & FieldValues;
  type Out = z.output<S>;
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(schema as never, opts.errorMap ? { error: opts.errorMap } : undefined) as unknown as Resolver<In, unknown, Out>,
    defaultValues: opts.defaultValues,
  });
  const [problem, setProblem] = useState<FormProblem | null>(null);
  const [pending, setPending] = useState(false);
  const last = useRef<Out | null>(null);

  // Default: a path the form holds a value at, or a top-level key of an object schema.
  const shape = (schema as unknown as { shape?: Record<string, unknown> }).shape;
  const fieldFor = opts.fieldFor ?? ((path: string) => (valueAt(form.getValues(), path) !== undefined || (shape && path in shape) ? path : null));

  async function send(values: Out, extra: Record<string, unknown> = {}): Promise<ApiResult<T>> {
    last.current = values;
    setProblem(null);
    setPending(true);
    const req = opts.request(values);
    const body = req.body === undefined ? values : req.body;
    let payload = Object.keys(extra).length ? { ...(body as object), ...extra } : body;
    const hold = opts.hold;
    if (hold) {
      const p = payload as Record<string, unknown>;
      payload = { ...p, clientId: typeof p.clientId === 'string' ? p.clientId : crypto.randomUUID() };
    }
    const keep = async () => {
      await hold!(req.url, payload as Record<string, unknown> & { clientId: string });
      setPending(false);
      last.current = null;
      await opts.onHeld?.(values);
      return HELD;
    };
    if (hold && browserOffline()) return keep();
    const r = await callApi<T>(req.url, { method: req.method ?? 'POST', body: payload });
    if (hold && !r.ok && holdAfterFailedSend(r.status)) return keep();
    setPending(false);
    if (r.ok) {
      last.current = null;
      await opts.onSuccess?.(r.data, values);
      return r;
    }
    const unplaced: string[] = [];
    for (const issue of r.issues ?? []) {
      const field = issue.path ? fieldFor(issue.path.replace(/\[(\d+)\]/g, '.$1')) : null;
      if (field) form.setError(field as Path<In>, { type: 'server', message: issue.message });
      else unplaced.push(issue.message);
    }
    const placedAll = (r.issues?.length ?? 0) > 0 && unplaced.length === 0;
    setProblem({
      status: r.status,
      message: placedAll ? 'Check the marked fields.' : [r.error, ...unplaced].join(' '),
      code: typeof r.body?.code === 'string' ? r.body.code : undefined,
      body: r.body,
    });
    await opts.onFailure?.(r);
    return r;
  }

  const submit = form.handleSubmit(async (values) => {
    await send(values);
  });
  const resend = async (extra: Record<string, unknown>) => (last.current ? send(last.current, extra) : undefined);
  return { form, submit, resend, problem, setProblem, pending: pending || form.formState.isSubmitting };
}
