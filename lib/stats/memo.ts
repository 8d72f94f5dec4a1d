import { LRUCache } from 'lru-cache';

/**
 * The statistics' cache: one set of aggregate queries per key every `ttlMs` however many people
 * open the figures, with one computation in flight per key. Once an entry is older than `ttlMs`
 * the next asker still gets it at once while one fresh computation runs in the background (so
 * nobody waits for the aggregates after the first time); the figures are at most `ttlMs` plus one
 * computation old. Per process (each app instance keeps its own). A failed refresh keeps nothing.
 */
export function memo<T extends object>(ttlMs: number, maxKeys = 200) {
  const cache = new LRUCache<string, T, () => Promise<T>>({
    max: maxKeys,
    ttl: ttlMs,
    allowStale: true,
    fetchMethod: (_key, _stale, { context }) => context(),
  });
  return async (key: string, compute: () => Promise<T>): Promise<T> => (await cache.fetch(key, { context: compute })) as T;
}
