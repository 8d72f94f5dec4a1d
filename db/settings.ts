import type { Knex } from 'knex';
import { db } from './index';
import type { ClubSettings } from './types';

/**
 * What a club that has not saved its settings yet gets (the migration's column defaults; no
 * contact address, so nothing is mailed to a made-up one).
 */
export const DEFAULT_CLUB_SETTINGS: ClubSettings = { clubName: 'Quietfix club', contactEmail: '', locateThresholdM: 75, reminderDays: 14, maxPositionAccuracyM: 30 };

/** The club's settings (the single club_settings row), read in the caller's transaction when given one. */
export async function getClubSettings(q: Knex = db): Promise<ClubSettings> {
  const row = await q('club_settings')
    .select({ clubName: 'club_name', contactEmail: 'contact_email', locateThresholdM: 'locate_threshold_m', reminderDays: 'reminder_days', maxPositionAccuracyM: 'max_position_accuracy_m' })
    .where({ id: 1 })
    .first();
  return row ?? DEFAULT_CLUB_SETTINGS;
}
