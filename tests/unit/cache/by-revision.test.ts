import { describe, expect, it } from 'vitest';
import { revisionCache } from '@/lib/cache/by-revision';

/** The revision-keyed cache (lib/cache/by-revision.ts): kept per key and revision, shared while in flight, nothing kept from a failure. */
describe('revisionCache', () => {
  const counter = () => {
    let calls = 0;
    return { compute: async () => ({ n: ++calls }), calls: () => calls };
  };

  it('computes once per key and revision, and again when the revision moves', async () => {
    const cache = revisionCache<{ n: number }>();
    const c = counter();
    expect(await cache('a', '1', c.compute)).toEqual({ n: 1 });
    expect(await cache('a', '1', c.compute)).toEqual({ n: 1 });
    expect(await cache('a', '2', c.compute)).toEqual({ n: 2 });
    expect(await cache('b', '2', c.compute)).toEqual({ n: 3 });
    expect(c.calls()).toBe(3);
  });

  it('askers of one key at once share one computation', async () => {
    const cache = revisionCache<{ n: number }>();
    let calls = 0;
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const compute = async () => {
      calls++;
      await gate;
      return { n: calls };
    };
    const all = Promise.all(Array.from({ length: 20 }, () => cache('k', '7', compute)));
    release();
    expect(new Set((await all).map((v) => v.n))).toEqual(new Set([1]));
    expect(calls).toBe(1);
  });

  it('a failed computation is not kept: the error reaches the asker and the next one computes afresh', async () => {
    const cache = revisionCache<{ ok: boolean }>();
    await expect(cache('k', '1', async () => Promise.reject(new Error('database down')))).rejects.toThrow('database down');
    expect(await cache('k', '1', async () => ({ ok: true }))).toEqual({ ok: true });
  });

  it('keeps within its size: the least recently used entries go first', async () => {
    const cache = revisionCache<{ s: string }>({ maxBytes: 3 * 2 * JSON.stringify({ s: 'x'.repeat(100) }).length });
    const c = { calls: 0 };
    const compute = async () => (c.calls++, { s: 'x'.repeat(100) });
    for (const k of ['a', 'b', 'c']) await cache(k, '1', compute);
    await cache('a', '1', compute); // a is now the most recently used
    await cache('d', '1', compute); // b goes
    expect(c.calls).toBe(4);
    await cache('a', '1', compute);
    expect(c.calls).toBe(4);
    await cache('b', '1', compute);
    expect(c.calls).toBe(5);
  });

  it('an entry is not kept past its age limit', async () => {
    const cache = revisionCache<{ n: number }>({ ttlMs: 30 });
    const c = counter();
    await cache('a', '1', c.compute);
    await new Promise((r) => setTimeout(r, 60));
    await cache('a', '1', c.compute);
    expect(c.calls()).toBe(2);
  });
});

/** The statistics' cache (lib/stats/memo.ts): fresh for its age limit, then the old figures answer while new ones are worked out. */
describe('memo (statistics)', () => {
  it('answers from the cache while fresh, then gives the old answer at once and the new one once it is ready', async () => {
    const { memo } = await import('@/lib/stats/memo');
    const cached = memo<{ n: number }>(40);
    let calls = 0;
    const compute = async () => {
      calls++;
      await new Promise((r) => setTimeout(r, 30));
      return { n: calls };
    };
    expect(await cached('k', compute)).toEqual({ n: 1 });
    expect(await cached('k', compute)).toEqual({ n: 1 });
    expect(calls).toBe(1);
    await new Promise((r) => setTimeout(r, 60));
    expect(await cached('k', compute)).toEqual({ n: 1 }); // the old figures, without waiting for the new ones…
    expect(calls).toBe(2); // …which are being worked out
    await new Promise((r) => setTimeout(r, 50));
    expect(await cached('k', compute)).toEqual({ n: 2 });
    expect(calls).toBe(2);
  });

  it('a failed computation is not kept', async () => {
    const { memo } = await import('@/lib/stats/memo');
    const cached = memo<{ ok: boolean }>(1000);
    await expect(cached('k', () => Promise.reject(new Error('down')))).rejects.toThrow('down');
    expect(await cached('k', async () => ({ ok: true }))).toEqual({ ok: true });
  });
});
