import type { Knex } from 'knex';
import { db } from './index';

/** The level log of a case (migrations/20261202061000_level_log.ts). */
export type LevelRow = {
  id: string;
  caseId: string;
  clientId: string | null;
  authorId: string | null;
  frequencyKhz: number;
  levelUnit: 'S' | 'dBm';
  levelValue: number;
  overS9Db: number;
  levelDbm: number;
  bandwidthHz: number;
  takenAt: Date;
  lat: number | null;
  lon: number | null;
  phase: 'before' | 'after';
};

const COLUMNS = {
  id: 'id',
  caseId: 'case_id',
  clientId: 'client_id',
  authorId: 'author_id',
  frequencyKhz: 'frequency_khz',
  levelUnit: 'level_unit',
  levelValue: 'level_value',
  overS9Db: 'over_s9_db',
  levelDbm: 'level_dbm',
  bandwidthHz: 'bandwidth_hz',
  takenAt: 'taken_at',
  lat: 'lat',
  lon: 'lon',
  phase: 'phase',
} as const;

const fromDb = (r: Record<string, unknown>): LevelRow => Object.fromEntries(Object.entries(COLUMNS).map(([k, col]) => [k, r[col]])) as LevelRow;

/** Stores one reading; a repeated clientId on the case returns the stored one (a retried send). */
export async function insertLevel(trx: Knex, r: Omit<LevelRow, 'id'>): Promise<{ row: LevelRow; created: boolean }> {
  const values = Object.fromEntries(Object.entries(COLUMNS).filter(([k]) => k !== 'id').map(([k, col]) => [col, r[k as keyof typeof r]]));
  const inserted = await trx('case_levels').insert(values).onConflict(['case_id', 'client_id']).ignore().returning('*');
  if (inserted.length) return { row: fromDb(inserted[0]), created: true };
  return { row: fromDb(await trx('case_levels').where({ case_id: r.caseId, client_id: r.clientId }).first()), created: false };
}

export async function listLevels(caseId: string, q: Knex = db): Promise<LevelRow[]> {
  return q('case_levels').where({ case_id: caseId }).orderBy('taken_at').select(COLUMNS);
}
