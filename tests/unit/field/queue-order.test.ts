/**
 * The offline queue's sending rule (lib/field/drain.ts): in the order typed, one at a time; a
 * stored item leaves, a refused one stays with the server's reason and the next is tried, no
 * connection / 5xx / 401 / 408 / 429 stops the run with the rest kept in order. The store here
 * is a plain in-memory list with the same three operations the IndexedDB store has; the real
 * IndexedDB queue runs in the browser test (tests/e2e/field-offline.spec.ts).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { classifyStatus, drainQueue, holdAfterFailedSend, inSendingOrder, type QueuedItem, type QueueStore, type SendResult } from '@/lib/field/drain';

function memoryStore(items: QueuedItem[]): QueueStore & { items: Map<string, QueuedItem> } {
  const map = new Map(items.map((i) => [i.clientId, i]));
  return {
    items: map,
    // any order: the drain must sort by itself
    all: async () => [...map.values()].reverse(),
    remove: async (id) => void map.delete(id),
    put: async (i) => void map.set(i.clientId, i),
  };
}

const item = (seq: number, kind: QueuedItem['kind'] = 'bearing', state: QueuedItem['state'] = 'waiting'): QueuedItem => ({
  clientId: `00000000-0000-4000-8000-${String(seq).padStart(12, '0')}`,
  seq,
  caseId: 'c',
  kind,
  url: `/api/cases/c/${kind}s`,
  body: { n: seq },
  createdAt: new Date(Date.UTC(2026, 11, 2, 5, 0, seq % 60)).toISOString(),
  state,
  attempts: 0,
});

describe('drainQueue', () => {
  it('sends in the order typed, whatever order the store returns, and empties the queue', async () => {
    const store = memoryStore([item(3, 'reading'), item(1), item(4, 'reading'), item(2, 'sweep')]);
    const order: number[] = [];
    const report = await drainQueue(store, async (i) => {
      order.push(i.seq);
      return { kind: 'stored', status: 201, data: { id: i.seq } };
    });
    expect(order).toEqual([1, 2, 3, 4]);
    expect(report.sent.map((s) => s.kind)).toEqual(['bearing', 'sweep', 'reading', 'reading']);
    expect(report.remaining).toBe(0);
  });

  it('a refused item stays with the reason; later ones still go; a repeat answer (200) counts as stored', async () => {
    const store = memoryStore([item(1), item(2), item(3)]);
    const answers: Record<number, SendResult> = {
      1: { kind: 'stored', status: 200, data: {} },
      2: { kind: 'refused', status: 403, message: 'Only the assigned hunter can add bearings.' },
      3: { kind: 'stored', status: 201, data: {} },
    };
    const report = await drainQueue(store, async (i) => answers[i.seq]);
    expect(report.sent.map((s) => s.status)).toEqual([200, 201]);
    expect(report.refused).toEqual([item(2).clientId]);
    expect(store.items.get(item(2).clientId)).toMatchObject({ state: 'refused', attempts: 1, refusal: { status: 403, message: 'Only the assigned hunter can add bearings.' } });
    // a refused item is not sent again until the hunter edits it
    const again: number[] = [];
    await drainQueue(store, async (i) => (again.push(i.seq), { kind: 'stored', status: 201, data: {} }));
    expect(again).toEqual([]);
  });

  it('no connection stops the run and keeps the rest in order', async () => {
    const store = memoryStore([item(1), item(2), item(3), item(4)]);
    let calls = 0;
    const report = await drainQueue(store, async (i) => (++calls, i.seq < 3 ? { kind: 'stored', status: 201, data: {} } : { kind: 'stopped', status: 0, message: 'No connection.' }));
    expect(calls).toBe(3);
    expect(report.stopped).toBe('No connection.');
    expect(inSendingOrder([...store.items.values()]).map((i) => i.seq)).toEqual([3, 4]);
    expect(store.items.get(item(3).clientId)!.attempts).toBe(1);
  });

  it('property: items are tried in seq order, the run stops only at a stop, the untried all wait', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.uniqueArray(fc.integer({ min: 1, max: 10_000 }), { minLength: 1, maxLength: 30 }),
        fc.array(fc.constantFrom<SendResult['kind']>('stored', 'refused', 'stopped'), { minLength: 30, maxLength: 30 }),
        async (seqs, outcomes) => {
          const store = memoryStore(seqs.map((s) => item(s)));
          const tried: number[] = [];
          await drainQueue(store, async (i) => {
            const k = outcomes[tried.length];
            tried.push(i.seq);
            return k === 'stored' ? { kind: 'stored', status: 201, data: {} } : k === 'refused' ? { kind: 'refused', status: 400, message: 'bad' } : { kind: 'stopped', status: 503, message: 'down' };
          });
          const sorted = [...seqs].sort((a, b) => a - b);
          expect(tried).toEqual(sorted.slice(0, tried.length));
          const stopAt = outcomes.slice(0, tried.length).indexOf('stopped');
          expect(stopAt === -1 ? tried.length === seqs.length : stopAt === tried.length - 1).toBe(true);
          for (const s of sorted.slice(tried.length)) expect(store.items.get(item(s).clientId)?.state).toBe('waiting');
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('classifyStatus', () => {
  it('2xx stored; 4xx refused except 401, 408, 429; 5xx and no answer stop', () => {
    expect([200, 201].map(classifyStatus)).toEqual(['stored', 'stored']);
    expect([400, 403, 404, 409, 413, 422].map(classifyStatus)).toEqual(Array(6).fill('refused'));
    expect([0, 401, 408, 429, 500, 503].map(classifyStatus)).toEqual(Array(6).fill('stopped'));
  });
});

describe('holdAfterFailedSend', () => {
  it('a first send with no answer or a retryable one goes to the queue; a refusal is shown at once; stored is not held', () => {
    expect([0, 401, 408, 429, 500, 502, 503, 504].map(holdAfterFailedSend)).toEqual(Array(8).fill(true));
    expect([200, 201, 400, 403, 404, 409, 413, 422].map(holdAfterFailedSend)).toEqual(Array(8).fill(false));
  });
});
