/** What a rejected request must leave alone: row counts per table and digests of chosen rows. */
import { db } from '@/db';

/** Tables requests write to (the outbox and sign-in failures change on their own: left out). */
const TABLES = [
  'users', 'club_settings', 'club_settings_events', 'cases', 'case_events', 'user_tokens', 'bearings', 'bearing_revisions', 'fix_snapshots',
  'level_readings', 'case_levels', 'case_premises', 'case_files', 'saved_filters', 'notice_templates', 'notices', 'notice_answers',
];

export async function rowCounts(): Promise<Record<string, number>> {
  const { rows } = await db.raw(TABLES.map((t) => `select '${t}' as t, count(*)::int as n from ${t}`).join(' union all '));
  return Object.fromEntries(rows.map((r: { t: string; n: number }) => [r.t, r.n]));
}

/**
 * md5 of whole rows, e.g. { cases: [id], 'notice_templates.key': ['first-notice'] } (the key
 * column is `id` unless named): any update shows as a different digest.
 */
export async function rowDigests(rows: Record<string, string[]>): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const [spec, ids] of Object.entries(rows)) {
    const [table, column = 'id'] = spec.split('.');
    for (const id of ids) {
      const r = await db(table).where(column, id).first(db.raw(`md5(to_jsonb(${table})::text) as d`));
      out[`${spec}:${id}`] = r?.d ?? 'missing';
    }
  }
  return out;
}

/** Counts and digests together, for a before/after comparison. */
export async function dbState(rows: Record<string, string[]> = {}) {
  return { counts: await rowCounts(), rows: await rowDigests(rows) };
}
