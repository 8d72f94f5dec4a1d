import type { Knex } from 'knex';
import { db } from './index';
import type { ClubSettings } from './types';

/**
 * What a club that has not saved its settings yet gets (the migration's column defaults; no
 * contact address, so nothing is mailed to a made-up one).
 */
export const DEFAULT_CLUB_SETTINGS: ClubSettings = {
  clubName: 'Quietfix club',
  contactEmail: '',
  locateThresholdM: 75,
  reminderDays: 14,
  maxPositionAccuracyM: 30,
  noiseEnvironment: 'residential',
  uploadMaxMb: 25,
};

const COLUMNS = {
  clubName: 'club_name',
  contactEmail: 'contact_email',
  locateThresholdM: 'locate_threshold_m',
  reminderDays: 'reminder_days',
  maxPositionAccuracyM: 'max_position_accuracy_m',
  noiseEnvironment: 'noise_environment',
  uploadMaxMb: 'upload_max_mb',
} as const;

/** The club's settings (the single club_settings row), read in the caller's transaction when given one. */
export async function getClubSettings(q: Knex = db): Promise<ClubSettings> {
  const row = await q('club_settings').select(COLUMNS).where({ id: 1 }).first();
  return row ?? DEFAULT_CLUB_SETTINGS;
}

/**
 * Writes the fields that changed and one entry on the settings timeline with each change's
 * before and after, in the caller's transaction (the row is locked first). Returns the changes.
 */
export async function updateClubSettings(trx: Knex.Transaction, actorId: string, patch: Partial<ClubSettings>): Promise<Record<string, { from: unknown; to: unknown }>> {
  await trx.raw('SELECT 1 FROM club_settings WHERE id = 1 FOR UPDATE');
  const current = await getClubSettings(trx);
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  const cols: Record<string, unknown> = {};
  for (const [k, col] of Object.entries(COLUMNS) as [keyof ClubSettings, string][]) {
    const v = patch[k];
    if (v !== undefined && v !== current[k]) {
      changes[k] = { from: current[k], to: v };
      cols[col] = v;
    }
  }
  if (Object.keys(changes).length === 0) return changes;
  const full = { ...Object.fromEntries(Object.entries(COLUMNS).map(([k, col]) => [col, current[k as keyof ClubSettings]])), ...cols };
  await trx('club_settings')
    .insert({ id: 1, ...full, updated_at: trx.fn.now() })
    .onConflict('id')
    .merge({ ...cols, updated_at: trx.fn.now(), version: trx.raw('club_settings.version + 1') });
  await trx('club_settings_events').insert({ actor_id: actorId, changes: JSON.stringify(changes) });
  return changes;
}

/** The settings timeline, newest first. */
export async function listSettingsEvents(limit = 50, q: Knex = db): Promise<{ id: string; actorName: string | null; changes: Record<string, { from: unknown; to: unknown }>; createdAt: Date }[]> {
  return q('club_settings_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .select({ id: 'e.id', actorName: 'u.name', changes: 'e.changes', createdAt: 'e.created_at' })
    .orderBy('e.id', 'desc')
    .limit(limit);
}
