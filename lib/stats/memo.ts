/**
 * A short-lived result cache with one computation in flight per key: many people opening the
 * statistics at once cost one set of aggregate queries every `ttlMs`. Per process (each app
 * instance keeps its own); the figures are at most `ttlMs` old.
 */
export function memo<T>(ttlMs: number, maxKeys = 200) {
  const entries = new Map<string, { at: number; value: Promise<T> }>();
  return (key: string, compute: () => Promise<T>): Promise<T> => {
    const now = Date.now();
    const hit = entries.get(key);
    if (hit && now - hit.at < ttlMs) return hit.value;
    if (entries.size >= maxKeys) entries.delete(entries.keys().next().value as string);
    const value = compute();
    entries.set(key, { at: now, value });
    value.catch(() => entries.delete(key));
    return value;
  };
}
