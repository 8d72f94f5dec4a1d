'use client';

import { useState } from 'react';
import { callApi } from '@/lib/api/client';
import { browserOffline, useFieldQueueHold } from '@/components/field/field-queue-context';

export type SubmitState = {
  pending: boolean;
  /** Plain message of the last failure (values stay in the form). */
  error: string | null;
  /** Set when the server wants the hunter to accept a coarse device position. */
  confirm: { message: string } | null;
};

/**
 * Sends a bearing or sweep and reads the answer the same way for both forms:
 * 400 issues go to their fields (unknown paths to the general message), 422 accuracy-unconfirmed
 * asks to "use it anyway" and resends with accuracyConfirmed, anything else is a plain message.
 * Inside the field screen each send carries a new clientId, and without a connection the item goes
 * to the phone's offline queue instead (`onSaved(null)`): nothing typed in the field is lost.
 * @param setFieldError puts a server message on a form field; returns false for a path the form lacks
 */
export function useHuntSubmit<TResult>(url: string, onSaved: (r: TResult | null) => void, setFieldError: (path: string, message: string) => boolean) {
  const hold = useFieldQueueHold();
  const [state, setState] = useState<SubmitState>({ pending: false, error: null, confirm: null });
  const [lastBody, setLastBody] = useState<Record<string, unknown> | null>(null);

  const send = async (typed: Record<string, unknown>) => {
    const body = hold ? { ...typed, clientId: typeof typed.clientId === 'string' ? typed.clientId : crypto.randomUUID() } : typed;
    setLastBody(body);
    setState({ pending: true, error: null, confirm: null });
    const queue = async () => {
      await hold!(url, body as typeof body & { clientId: string });
      setState({ pending: false, error: null, confirm: null });
      setLastBody(null);
      onSaved(null);
    };
    if (hold && browserOffline()) return queue();
    const r = await callApi<TResult>(url, { method: 'POST', body });
    if (hold && !r.ok && r.status === 0) return queue();
    if (r.ok) {
      setState({ pending: false, error: null, confirm: null });
      setLastBody(null);
      onSaved(r.data);
      return;
    }
    if (r.status === 422 && r.body?.code === 'accuracy-unconfirmed') {
      setState({ pending: false, error: null, confirm: { message: r.error } });
      return;
    }
    const issues = r.issues ?? [];
    const unplaced = issues.filter((i) => !setFieldError(i.path, i.message));
    const error = issues.length === 0 ? r.error : unplaced.length ? [r.error, ...unplaced.map((i) => i.message)].join(' ') : 'Check the marked fields.';
    setState({ pending: false, error, confirm: null });
  };

  /** Resends the last body, accepting the coarse position. */
  const confirmAnyway = () => (lastBody ? send({ ...lastBody, accuracyConfirmed: true }) : undefined);

  return { state, send, confirmAnyway };
}
