import type { Knex } from 'knex';
import { db } from './index';
import { normalizeFix, type Fix } from '@/lib/df';

export type FixSnapshotRow = { id: string; caseId: string; cause: string; lineCount: number; ok: boolean; lat: number | null; lon: number | null; semiMajorM: number | null; result: Fix; createdAt: Date };

const COLUMNS = {
  id: 'id',
  caseId: 'case_id',
  cause: 'cause',
  lineCount: 'line_count',
  ok: 'ok',
  lat: 'lat',
  lon: 'lon',
  semiMajorM: 'semi_major_m',
  result: 'result',
  createdAt: 'created_at',
} as const;

export async function insertFixSnapshot(trx: Knex.Transaction, caseId: string, cause: string, lineCount: number, fix: Fix): Promise<void> {
  await trx('fix_snapshots').insert({
    case_id: caseId,
    cause,
    line_count: lineCount,
    ok: fix.ok,
    lat: fix.ok ? fix.lat : null,
    lon: fix.ok ? fix.lon : null,
    semi_major_m: fix.ok ? fix.ellipse.semiMajorM : null,
    semi_minor_m: fix.ok ? fix.ellipse.semiMinorM : null,
    major_axis_azimuth_deg: fix.ok ? fix.ellipse.majorAxisAzimuthDeg : null,
    result: JSON.stringify(fix),
  });
}

/** The newest snapshot; its result is brought to the current Fix shape (older snapshots still render). */
export async function latestFixSnapshot(caseId: string, q: Knex = db): Promise<FixSnapshotRow | undefined> {
  const row: FixSnapshotRow | undefined = await q('fix_snapshots').select(COLUMNS).where({ case_id: caseId }).orderBy('id', 'desc').first();
  return row ? { ...row, result: normalizeFix(row.result) } : undefined;
}

/** Every snapshot, oldest first, without the full result (the convergence trail). */
export async function fixTrail(caseId: string, q: Knex = db): Promise<Omit<FixSnapshotRow, 'result'>[]> {
  const { result: _omit, ...cols } = COLUMNS;
  return q('fix_snapshots').select(cols).where({ case_id: caseId }).orderBy('id', 'asc').limit(500);
}
