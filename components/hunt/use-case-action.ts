'use client';

import { useState } from 'react';
import { callApi, type ApiResult } from '@/lib/api/client';

export type ActionMessage = { tone: 'info' | 'warn' | 'error'; text: string };

/**
 * Sends one change to a case and turns the answer into a plain message: a stale version (409)
 * refreshes the page data so the person sees what changed; a broken rule (422) says which.
 */
export function useCaseAction(refresh: () => Promise<unknown>) {
  const [message, setMessage] = useState<ActionMessage | null>(null);
  const [busy, setBusy] = useState(false);

  async function run<T>(url: string, init: { method?: string; body?: unknown }, success: string): Promise<ApiResult<T>> {
    setBusy(true);
    setMessage(null);
    const r = await callApi<T>(url, init);
    setBusy(false);
    if (r.ok) {
      setMessage({ tone: 'info', text: success });
      await refresh();
    } else if (r.status === 409) {
      setMessage({ tone: 'warn', text: `${r.error} The page now shows the latest version; check it and try again.` });
      await refresh();
    } else {
      setMessage({ tone: 'error', text: r.error });
    }
    return r;
  }

  return { message, setMessage, busy, run };
}
