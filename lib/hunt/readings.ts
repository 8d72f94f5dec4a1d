import type { Knex } from 'knex';
import type { z } from 'zod';
import { findLevelReadingByClientId, getLevelReading, insertLevelReading, type LevelReadingWithAuthor } from '@/db/level-readings';
import { getProfile } from '@/db/users';
import type { CaseRow, User } from '@/db/types';
import { sUnitsToDbm, trailPeak, type TrailPeak } from '@/lib/df';
import { conflict, forbidden } from '@/lib/errors';
import type { readingInputSchema } from '@/lib/validation/readings';
import { caseAccess } from './access';

type ReadingInput = z.output<typeof readingInputSchema>;

/** A level reading as the API shows it. */
export type LevelReadingView = {
  id: string;
  clientId: string | null;
  source: 'walk' | 'gpx';
  lat: number;
  lon: number;
  accuracyM: number | null;
  level: { unit: 'S' | 'dBm'; value: number };
  levelDbm: number;
  frequencyKhz: number | null;
  note: string;
  takenAt: string;
  author: { id: string; name: string; callSign: string | null } | null;
};

export function toLevelReadingView(r: LevelReadingWithAuthor): LevelReadingView {
  return {
    id: r.id,
    clientId: r.clientId,
    source: r.source,
    lat: r.lat,
    lon: r.lon,
    accuracyM: r.accuracyM,
    level: { unit: r.levelUnit, value: r.levelValue },
    levelDbm: r.levelDbm,
    frequencyKhz: r.frequencyKhz,
    note: r.note,
    takenAt: new Date(r.takenAt).toISOString(),
    author: r.authorId ? { id: r.authorId, name: r.authorName ?? '', callSign: r.authorCallSign } : null,
  };
}

/** The smoothed peak of a trail (lib/df trailPeak) in the answer's shape, or null. */
export function trailPeakView(items: Pick<LevelReadingView, 'lat' | 'lon' | 'levelDbm'>[]): Omit<TrailPeak, 'smoothedDbm' | 'pathM'> | null {
  const p = trailPeak(items);
  return p && { index: p.index, lat: p.lat, lon: p.lon, levelDbm: p.levelDbm };
}

/**
 * Level in dBm at the receiver input from a reading: S-units by the IARU Region 1 scale at the
 * frequency (6 dB per unit, past S9 on the same scale), then the hunter's S-meter offset removed.
 */
export function readingDbm(level: { unit: 'S' | 'dBm'; value: number }, frequencyKhz: number | null | undefined, sMeterOffsetDb: number): number {
  const raw = level.unit === 'S' ? sUnitsToDbm(level.value, 0, (frequencyKhz ?? 7000) * 1000) : level.value;
  return Math.round((raw - sMeterOffsetDb) * 1000) / 1000;
}

/**
 * The row already stored under a client id, when it is this caller's item in this case (a retry):
 * null when the id is new; 409 when the id belongs to someone else's item or another case.
 */
export function sameItemOrConflict<T extends { caseId: string; authorId: string | null }>(existing: T | undefined, user: User, caseId: string): T | null {
  if (!existing) return null;
  if (existing.caseId !== caseId || existing.authorId !== user.id) {
    throw conflict('This clientId was already used for a different item. Make a new one for each item you send.', { code: 'client-id-taken' });
  }
  return existing;
}

/**
 * Stores one level reading of the walk. A repeat of an item already stored (same clientId) answers
 * the stored row and stores nothing (`repeat: true`), so a retried send never makes a second one.
 * Call with the case row locked (`lockVisibleCase`), which also serialises retries racing each other.
 */
export async function addLevelReading(trx: Knex.Transaction, user: User, row: CaseRow, input: ReadingInput): Promise<{ reading: LevelReadingView; repeat: boolean }> {
  const before = sameItemOrConflict(await findLevelReadingByClientId(input.clientId, trx), user, row.id);
  if (before) return { reading: toLevelReadingView(before), repeat: true };
  if (!caseAccess(user, row).hunt) throw forbidden('Only the assigned hunter or a coordinator can add readings to this case, while it is being hunted.');
  const offset = (await getProfile(user.id, trx))?.sMeterOffsetDb ?? 0;
  const id = await insertLevelReading(trx, row.id, user.id, {
    clientId: input.clientId,
    source: 'walk',
    lat: input.lat,
    lon: input.lon,
    accuracyM: input.accuracyM ?? null,
    levelUnit: input.level.unit,
    levelValue: input.level.value,
    levelDbm: readingDbm(input.level, input.frequencyKhz, offset),
    frequencyKhz: input.frequencyKhz ?? null,
    note: input.note,
    takenAt: new Date(input.takenAt),
  });
  return { reading: toLevelReadingView((await getLevelReading(id, trx))!), repeat: false };
}
