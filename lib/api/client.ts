/** Browser-side JSON calls to our route handlers, with the error body read the same way everywhere. */
import { STORED_AT_HEADER } from '@/lib/field/cache-names';

/** Event on `window` for every answer: `storedAt` is set when the service worker answered from its copy (offline). */
export const ANSWER_EVENT = 'quietfix:answer';
export type AnswerDetail = { url: string; storedAt: string | null };

export type ApiResult<T> =
  | { ok: true; status: number; data: T }
  | { ok: false; status: number; error: string; issues?: { path: string; message: string }[]; body?: Record<string, unknown> };

export async function callApi<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<ApiResult<T>> {
  try {
    const res = await fetch(url, {
      method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
      headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
    const data = await res.json().catch(() => ({}));
    if (typeof window !== 'undefined') {
      window.dispatchEvent(new CustomEvent<AnswerDetail>(ANSWER_EVENT, { detail: { url, storedAt: res.headers.get(STORED_AT_HEADER) } }));
    }
    if (res.ok) return { ok: true, status: res.status, data: data as T };
    return { ok: false, status: res.status, error: data.error ?? `The server answered ${res.status}.`, issues: data.issues, body: data };
  } catch {
    return { ok: false, status: 0, error: 'Could not reach Quietfix. Check your connection and try again.' };
  }
}

/** SWR fetcher: throws the server's plain message so error boundaries can show it. */
export async function fetchJson<T>(url: string): Promise<T> {
  const r = await callApi<T>(url);
  if (!r.ok) throw new Error(r.error);
  return r.data;
}

/** Whether the browser says it is offline (a request would fail at once). */
export const browserOffline = () => typeof navigator !== 'undefined' && navigator.onLine === false;
