import { LRUCache } from 'lru-cache';

/**
 * Answers kept under the data revision read before they were computed (db/revisions.ts). A
 * transaction that writes the data raises the revision at its commit, so an entry found under the
 * current revision was computed from data at least that new: exact, on every app instance alike,
 * with no message between instances. Entries of older revisions are never asked for again and age
 * out (least recently used first, within `maxBytes`; at most `ttlMs` old, which also bounds answers
 * that depend on the clock, such as "in this state for 7 days or more"). Concurrent askers of one
 * key share one computation. Entries are shared: callers must not change what they get.
 */
export function revisionCache<T extends object>({ maxBytes = 64 * 1024 * 1024, ttlMs = 60_000 } = {}) {
  const cache = new LRUCache<string, T, () => Promise<T>>({
    maxSize: maxBytes,
    // UTF-16 code units of the JSON the answer becomes: near enough to the memory it holds.
    sizeCalculation: (value) => Math.max(1, JSON.stringify(value).length * 2),
    ttl: ttlMs,
    fetchMethod: (_key, _stale, { context }) => context(),
  });
  return async (key: string, revision: string, compute: () => Promise<T>): Promise<T> =>
    (await cache.fetch(`${revision}\u0000${key}`, { context: compute })) as T;
}
