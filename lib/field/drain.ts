/**
 * The offline queue's sending rule, apart from where the items are kept (IndexedDB on the phone,
 * see ./queue.ts) and how they travel (fetch): pure, unit-tested.
 *
 * Items go out one at a time in the order they were typed (`seq`). An item the server stored
 * (2xx, also the 200 a repeat of the same clientId gets) leaves the queue. An item the server
 * refuses (a 4xx other than 401, 408 and 429: validation, case closed, not allowed) stays, marked
 * with the server's reason, and the next item is tried. No connection, a 5xx, 401 (signed out),
 * 408 or 429 stops the run: the rest waits, in order, for the next one.
 */

export type QueueKind = 'bearing' | 'sweep' | 'reading';

export type QueuedItem = {
  /** the UUID the server stores (a retry finds the stored row) */
  clientId: string;
  /** position in the queue: the order the hunter typed them */
  seq: number;
  caseId: string;
  kind: QueueKind;
  /** the API path it is sent to (POST) */
  url: string;
  body: Record<string, unknown>;
  /** ISO time it was typed */
  createdAt: string;
  state: 'waiting' | 'refused';
  attempts: number;
  /** the server's answer when it refused the item */
  refusal?: { status: number; message: string; issues?: { path: string; message: string }[] };
};

export type SendResult =
  | { kind: 'stored'; status: number; data: unknown }
  | { kind: 'refused'; status: number; message: string; issues?: { path: string; message: string }[] }
  | { kind: 'stopped'; status: number; message: string };

/** What a queue keeps, however it keeps it. */
export interface QueueStore {
  /** every item, any order */
  all(): Promise<QueuedItem[]>;
  remove(clientId: string): Promise<void>;
  put(item: QueuedItem): Promise<void>;
}

export type DrainReport = {
  sent: { clientId: string; kind: QueueKind; status: number; data: unknown }[];
  refused: string[];
  /** why the run stopped early, if it did */
  stopped?: string;
  remaining: number;
};

/** Sorts the way items go out: by seq, then by the time typed. */
export function inSendingOrder(items: QueuedItem[]): QueuedItem[] {
  return [...items].sort((a, b) => a.seq - b.seq || a.createdAt.localeCompare(b.createdAt) || a.clientId.localeCompare(b.clientId));
}

/** How an HTTP status ends an attempt: stored, refused for good (needs the hunter), or stop and retry later. */
export function classifyStatus(status: number): 'stored' | 'refused' | 'stopped' {
  if (status >= 200 && status < 300) return 'stored';
  if (status >= 400 && status < 500 && ![401, 408, 429].includes(status)) return 'refused';
  return 'stopped';
}

/**
 * Whether a first send that did not store the item hands it to the queue instead of showing an
 * error: no answer (status 0), or any answer the queue itself would retry (5xx, 401, 408, 429).
 * A refusal (the other 4xx) is shown at once, while the hunter can still fix it.
 */
export function holdAfterFailedSend(status: number): boolean {
  return status === 0 || classifyStatus(status) === 'stopped';
}

/** Sends every waiting item in order (see the module comment); refused items are left alone. */
export async function drainQueue(store: QueueStore, send: (item: QueuedItem) => Promise<SendResult>): Promise<DrainReport> {
  const report: DrainReport = { sent: [], refused: [], remaining: 0 };
  for (const item of inSendingOrder(await store.all())) {
    if (item.state !== 'waiting') continue;
    const r = await send(item);
    if (r.kind === 'stored') {
      await store.remove(item.clientId);
      report.sent.push({ clientId: item.clientId, kind: item.kind, status: r.status, data: r.data });
    } else if (r.kind === 'refused') {
      await store.put({ ...item, state: 'refused', attempts: item.attempts + 1, refusal: { status: r.status, message: r.message, issues: r.issues } });
      report.refused.push(item.clientId);
    } else {
      await store.put({ ...item, attempts: item.attempts + 1 });
      report.stopped = r.message;
      break;
    }
  }
  report.remaining = (await store.all()).length;
  return report;
}
