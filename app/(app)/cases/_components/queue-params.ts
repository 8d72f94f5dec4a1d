/** The queue's view as URL parameters: the filters the queue, map and statistics share, and the table's own. */
export const FILTER_KEYS = ['status', 'assigneeId', 'band', 'q', 'minDays', 'area'] as const;
export const TABLE_KEYS = ['sort', 'dir', 'cursor', 'page', 'pageSize'] as const;

/** Only the named keys, empty ones dropped. */
export function pick(sp: URLSearchParams, keys: readonly string[]): URLSearchParams {
  const out = new URLSearchParams();
  for (const k of keys) {
    const v = sp.get(k);
    if (v) out.set(k, v);
  }
  return out;
}

/** The view with some keys changed (null removes one); a filter or sort change goes back to the first page. */
export function withChanges(sp: URLSearchParams, changes: Record<string, string | null>): URLSearchParams {
  const out = pick(sp, [...FILTER_KEYS, ...TABLE_KEYS]);
  for (const [k, v] of Object.entries(changes)) {
    if (v === null || v === '') out.delete(k);
    else out.set(k, v);
  }
  if (!('cursor' in changes)) out.delete('cursor');
  if (!('page' in changes)) out.delete('page');
  return out;
}

export const bboxText = (b: { west: number; south: number; east: number; north: number }) =>
  [b.west, b.south, b.east, b.north].map((x) => x.toFixed(5)).join(',');
