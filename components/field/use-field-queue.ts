'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { discardQueued, enqueue, flushQueue, listQueued, QUEUE_CHANNEL, updateQueued, type DrainReport, type QueuedItem, type QueueKind } from '@/lib/field/queue';

const KIND_BY_PATH: [RegExp, QueueKind][] = [
  [/\/bearings$/, 'bearing'],
  [/\/sweeps$/, 'sweep'],
  [/\/readings$/, 'reading'],
];

/** The queue kind of an API path (…/bearings, …/sweeps, …/readings). */
export function queueKindOf(url: string): QueueKind {
  const hit = KIND_BY_PATH.find(([re]) => re.test(url));
  if (!hit) throw new Error(`Nothing of ${url} can wait in the field queue.`);
  return hit[1];
}

export type FieldQueue = {
  items: QueuedItem[];
  waiting: QueuedItem[];
  refused: QueuedItem[];
  online: boolean;
  /** the last sending run's outcome, with when it ended (ms since epoch) */
  last: (DrainReport & { at: number }) | null;
  hold: (url: string, body: Record<string, unknown> & { clientId: string }) => Promise<void>;
  flush: () => Promise<void>;
  discard: (clientId: string) => Promise<void>;
  edit: (clientId: string, body: Record<string, unknown>) => Promise<void>;
};

/**
 * The offline queue of one case as the field screen shows it: read from IndexedDB, redrawn when any
 * tab or the service worker changes it, and sent when the connection returns, when the screen
 * becomes visible again, and on demand. `onSent` runs after a run that stored something.
 */
export function useFieldQueue(caseId: string, onSent: () => void): FieldQueue {
  const [items, setItems] = useState<QueuedItem[]>([]);
  const [online, setOnline] = useState(true);
  const [last, setLast] = useState<FieldQueue['last']>(null);
  const onSentRef = useRef(onSent);
  onSentRef.current = onSent;

  const reload = useCallback(async () => setItems(await listQueued(caseId).catch(() => [])), [caseId]);
  const flush = useCallback(async () => {
    if (!navigator.onLine) return;
    const report = await flushQueue();
    if (report) {
      setLast({ ...report, at: Date.now() });
      if (report.sent.length) onSentRef.current();
    }
    await reload();
  }, [reload]);

  useEffect(() => {
    setOnline(navigator.onLine);
    void reload().then(() => flush());
    const wentOnline = () => {
      setOnline(true);
      void flush();
    };
    const wentOffline = () => setOnline(false);
    const visible = () => {
      if (document.visibilityState === 'visible') void flush();
    };
    window.addEventListener('online', wentOnline);
    window.addEventListener('offline', wentOffline);
    document.addEventListener('visibilitychange', visible);
    let channel: BroadcastChannel | null = null;
    try {
      channel = new BroadcastChannel(QUEUE_CHANNEL);
      channel.onmessage = (e: MessageEvent<{ report?: DrainReport }>) => {
        void reload();
        if (e.data?.report?.sent.length) onSentRef.current();
      };
    } catch {
      // older browser: the events above still redraw
    }
    return () => {
      window.removeEventListener('online', wentOnline);
      window.removeEventListener('offline', wentOffline);
      document.removeEventListener('visibilitychange', visible);
      channel?.close();
    };
  }, [reload, flush]);

  return {
    items,
    waiting: items.filter((i) => i.state === 'waiting'),
    refused: items.filter((i) => i.state === 'refused'),
    online,
    last,
    hold: async (url, body) => {
      await enqueue(caseId, queueKindOf(url), url, body);
      await reload();
      void flush();
    },
    flush,
    discard: async (clientId) => {
      await discardQueued(clientId);
      await reload();
    },
    edit: async (clientId, body) => {
      await updateQueued(clientId, body);
      await reload();
      void flush();
    },
  };
}
