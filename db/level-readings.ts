import type { Knex } from 'knex';
import { db } from './index';
import type { LevelReadingRow } from './types';

const COLUMNS = {
  id: 'r.id',
  caseId: 'r.case_id',
  authorId: 'r.author_id',
  clientId: 'r.client_id',
  source: 'r.source',
  lat: 'r.lat',
  lon: 'r.lon',
  accuracyM: 'r.accuracy_m',
  levelUnit: 'r.level_unit',
  levelValue: 'r.level_value',
  levelDbm: 'r.level_dbm',
  frequencyKhz: 'r.frequency_khz',
  note: 'r.note',
  takenAt: 'r.taken_at',
  createdAt: 'r.created_at',
} as const;

export type LevelReadingWithAuthor = LevelReadingRow & { authorName: string | null; authorCallSign: string | null };

function withAuthor(q: Knex) {
  return q('level_readings as r')
    .leftJoin('users as u', 'u.id', 'r.author_id')
    .select({ ...COLUMNS, authorName: 'u.name', authorCallSign: 'u.call_sign' });
}

/** A case's level readings in the order they were taken (the trail as walked). */
export async function listLevelReadings(caseId: string, q: Knex = db): Promise<LevelReadingWithAuthor[]> {
  return withAuthor(q).where('r.case_id', caseId).orderBy([{ column: 'r.taken_at' }, { column: 'r.created_at' }, { column: 'r.id' }]);
}

export async function getLevelReading(id: string, q: Knex = db): Promise<LevelReadingWithAuthor | undefined> {
  return withAuthor(q).where('r.id', id).first();
}

/** The reading a phone already sent under this client id, in any case (client ids are unique). */
export async function findLevelReadingByClientId(clientId: string, q: Knex = db): Promise<LevelReadingWithAuthor | undefined> {
  return withAuthor(q).where('r.client_id', clientId).first();
}

export type NewLevelReading = Omit<LevelReadingRow, 'id' | 'caseId' | 'authorId' | 'createdAt'>;

export async function insertLevelReading(trx: Knex.Transaction, caseId: string, authorId: string, r: NewLevelReading): Promise<string> {
  const [row] = await trx('level_readings')
    .insert({
      case_id: caseId,
      author_id: authorId,
      client_id: r.clientId,
      source: r.source,
      lat: r.lat,
      lon: r.lon,
      accuracy_m: r.accuracyM,
      level_unit: r.levelUnit,
      level_value: r.levelValue,
      level_dbm: r.levelDbm,
      frequency_khz: r.frequencyKhz,
      note: r.note,
      taken_at: r.takenAt,
    })
    .returning('id');
  return row.id;
}
