/**
 * The phone's offline queue in IndexedDB (idb): bearings, sweeps and level readings typed without
 * a connection (or whose send failed) wait here across reloads and restarts, and go out in order
 * (./drain.ts) on reconnect, when the page becomes visible, or from the service worker's
 * Background Sync. Runs in pages and in the service worker; browser only.
 */
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import { classifyStatus, drainQueue, type DrainReport, type QueuedItem, type QueueKind, type QueueStore, type SendResult } from './drain';

export type { QueuedItem, QueueKind, DrainReport } from './drain';

/** Background Sync tag the worker listens for. */
export const QUEUE_SYNC_TAG = 'quietfix-queue';
/** BroadcastChannel on which every change of the queue is announced (pages redraw). */
export const QUEUE_CHANNEL = 'quietfix-queue';

interface FieldDb extends DBSchema {
  queue: { key: string; value: QueuedItem; indexes: { seq: number; caseId: string } };
}

let dbPromise: Promise<IDBPDatabase<FieldDb>> | null = null;
function fieldDb() {
  dbPromise ??= openDB<FieldDb>('quietfix-field', 1, {
    upgrade(db) {
      const q = db.createObjectStore('queue', { keyPath: 'clientId' });
      q.createIndex('seq', 'seq');
      q.createIndex('caseId', 'caseId');
    },
  });
  return dbPromise;
}

function announce(report?: DrainReport) {
  try {
    const ch = new BroadcastChannel(QUEUE_CHANNEL);
    ch.postMessage({ type: 'changed', report });
    ch.close();
  } catch {
    // no BroadcastChannel: pages still redraw on their own events
  }
}

const store: QueueStore = {
  all: async () => (await fieldDb()).getAllFromIndex('queue', 'seq'),
  remove: async (clientId) => (await fieldDb()).delete('queue', clientId).then(() => undefined),
  put: async (item) => (await fieldDb()).put('queue', item).then(() => undefined),
};

/** Every queued item of a case (all cases when none is named), in sending order. */
export async function listQueued(caseId?: string): Promise<QueuedItem[]> {
  const db = await fieldDb();
  const items = caseId ? await db.getAllFromIndex('queue', 'caseId', caseId) : await db.getAllFromIndex('queue', 'seq');
  return items.sort((a, b) => a.seq - b.seq);
}

/** Puts an item at the end of the queue (its body must already carry its clientId). */
export async function enqueue(caseId: string, kind: QueueKind, url: string, body: Record<string, unknown> & { clientId: string }): Promise<QueuedItem> {
  const db = await fieldDb();
  const tx = db.transaction('queue', 'readwrite');
  const last = await tx.store.index('seq').openCursor(null, 'prev');
  const item: QueuedItem = { clientId: body.clientId, seq: (last?.value.seq ?? 0) + 1, caseId, kind, url, body, createdAt: new Date().toISOString(), state: 'waiting', attempts: 0 };
  await tx.store.put(item);
  await tx.done;
  announce();
  void askForBackgroundSync();
  return item;
}

/** A refused item after the hunter edited it: waits again, at its old place in the order. */
export async function updateQueued(clientId: string, body: Record<string, unknown>): Promise<void> {
  const db = await fieldDb();
  const item = await db.get('queue', clientId);
  if (!item) return;
  await db.put('queue', { ...item, body: { ...body, clientId }, state: 'waiting', refusal: undefined });
  announce();
}

export async function discardQueued(clientId: string): Promise<void> {
  await (await fieldDb()).delete('queue', clientId);
  announce();
}

/** One POST of a queued item; the answer classified by ./drain.ts's rule. */
export async function sendItem(item: QueuedItem): Promise<SendResult> {
  let res: Response;
  try {
    res = await fetch(item.url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(item.body), credentials: 'same-origin' });
  } catch {
    return { kind: 'stopped', status: 0, message: 'No connection.' };
  }
  const data = await res.json().catch(() => ({}));
  const how = classifyStatus(res.status);
  if (how === 'stored') return { kind: 'stored', status: res.status, data };
  const message = typeof data.error === 'string' ? data.error : `The server answered ${res.status}.`;
  if (how === 'refused') return { kind: 'refused', status: res.status, message, issues: data.issues };
  return { kind: 'stopped', status: res.status, message };
}

/**
 * Sends what waits, in order, one run at a time across every tab and the service worker (Web
 * Locks; a run that finds another in progress returns null). Each item's clientId makes a send
 * that overlapped anyway harmless: the server answers the row it already has.
 */
export async function flushQueue(): Promise<DrainReport | null> {
  const locks = (globalThis.navigator as Navigator | undefined)?.locks;
  const run = async () => {
    const report = await drainQueue(store, sendItem);
    announce(report);
    return report;
  };
  if (!locks) return run();
  return locks.request('quietfix-queue-drain', { ifAvailable: true }, async (lock) => (lock ? run() : null));
}

/** Asks the browser to wake the service worker when the connection returns (Background Sync, where it exists). */
export async function askForBackgroundSync(): Promise<boolean> {
  try {
    if (!globalThis.navigator?.serviceWorker?.controller) return false;
    const reg = await navigator.serviceWorker.ready;
    const sync = (reg as ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } } | undefined)?.sync;
    if (!sync) return false;
    await sync.register(QUEUE_SYNC_TAG);
    return true;
  } catch {
    return false;
  }
}
