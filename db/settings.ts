import { db } from './index';
import type { ClubSettings } from './types';

export async function getClubSettings(): Promise<ClubSettings> {
  const row = await db('club_settings')
    .select({ clubName: 'club_name', contactEmail: 'contact_email', locateThresholdM: 'locate_threshold_m', reminderDays: 'reminder_days', maxPositionAccuracyM: 'max_position_accuracy_m', uploadMaxMb: 'upload_max_mb' })
    .where({ id: 1 })
    .first();
  return row ?? { clubName: 'Quietfix club', contactEmail: 'committee@example.test', locateThresholdM: 75, reminderDays: 14, maxPositionAccuracyM: 30, uploadMaxMb: 25 };
}
