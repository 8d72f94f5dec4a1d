import type { Knex } from 'knex';
import { db } from './index';
import { applyQueueFilter, LIST_COLUMNS } from './queue';
import { whereCaseRight } from './case-scope';
import type { LevelRow } from './levels';
import type { Role } from './types';
import type { QueueFilter } from '@/lib/validation/queue';

const BATCH = 1000;

export type ExportCaseRow = {
  id: string;
  reference: string;
  title: string;
  status: string;
  bands: string[];
  createdAt: Date;
  lastActivityAt: Date;
  assigneeName: string | null;
  lat: number | null;
  lon: number | null;
  fixSizeM: number | null;
  noticeCount: number;
  outcome: string | null;
  levelBeforeDbm: number | null;
  levelAfterDbm: number | null;
};

/**
 * The filtered cases, in reference order, a thousand at a time (keyset on the unique reference):
 * an export of 100,000 cases never sits in memory. Positions are the map position (the fix, else
 * the reported position) and only for the committee, who may see both.
 */
export async function* exportCaseBatches(viewer: { id: string; role: Role }, f: QueueFilter, q: Knex = db): AsyncGenerator<ExportCaseRow[]> {
  let after: string | null = null;
  for (;;) {
    const b = applyQueueFilter(q('cases as c'), viewer, f)
      .leftJoin('users as u', 'u.id', 'c.assignee_id')
      .select({ ...LIST_COLUMNS, outcome: 'c.outcome', levelBeforeDbm: 'c.level_before_dbm', levelAfterDbm: 'c.level_after_dbm' })
      .select(q.raw('ST_Y(c.map_point) as lat'), q.raw('ST_X(c.map_point) as lon'))
      .orderBy('c.reference')
      .limit(BATCH);
    if (after !== null) b.where('c.reference', '>', after);
    const rows = (await b) as ExportCaseRow[];
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < BATCH) return;
    after = rows[rows.length - 1].reference;
  }
}

export type ExportLevelRow = Pick<LevelRow, 'id' | 'frequencyKhz' | 'levelDbm' | 'bandwidthHz' | 'takenAt' | 'lat' | 'lon' | 'phase'> & { caseReference: string };

/**
 * Level-log readings (case_levels) of the cases `scope` leaves in, in case-reference then time
 * order, a thousand at a time (keyset on reference, taken_at, id): never the whole log in memory.
 * Only cases whose hunt the viewer may see (the level log is part of the hunt).
 */
async function* levelBatches(viewer: { id: string; role: Role }, scope: (b: Knex.QueryBuilder) => Knex.QueryBuilder, q: Knex): AsyncGenerator<ExportLevelRow[]> {
  let after: [string, string, string] | null = null;
  for (;;) {
    const b = scope(whereCaseRight(q('cases as c'), viewer, 'seeHunt'))
      .join('case_levels as l', 'l.case_id', 'c.id')
      .select({ id: 'l.id', caseReference: 'c.reference', frequencyKhz: 'l.frequency_khz', levelDbm: 'l.level_dbm', bandwidthHz: 'l.bandwidth_hz', takenAt: 'l.taken_at', lat: 'l.lat', lon: 'l.lon', phase: 'l.phase' })
      .select(q.raw('l.taken_at::text as taken_at_key'))
      .orderBy([{ column: 'c.reference' }, { column: 'l.taken_at' }, { column: 'l.id' }])
      .limit(BATCH);
    if (after !== null) b.whereRaw('(c.reference, l.taken_at, l.id) > (?, ?::timestamptz, ?::uuid)', after);
    const rows = (await b) as (ExportLevelRow & { taken_at_key: string })[];
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < BATCH) return;
    const last = rows[rows.length - 1];
    after = [last.caseReference, last.taken_at_key, last.id];
  }
}

/** One case's level log, streamed (see levelBatches). */
export const caseLevelBatches = (viewer: { id: string; role: Role }, caseId: string, q: Knex = db) => levelBatches(viewer, (b) => b.where('c.id', caseId), q);

/** The level logs of the cases matching the queue's filters, streamed (see levelBatches). */
export const filteredLevelBatches = (viewer: { id: string; role: Role }, f: QueueFilter, q: Knex = db) => levelBatches(viewer, (b) => applyQueueFilter(b, viewer, f), q);

/** What the club export holds, table by table (no password hashes, no token secrets). */
export const CLUB_EXPORT_TABLES: Record<string, string[]> = {
  club_settings: ['id', 'club_name', 'contact_email', 'locate_threshold_m', 'reminder_days', 'max_position_accuracy_m', 'noise_environment', 'upload_max_mb', 'updated_at'],
  users: ['id', 'email', 'name', 'call_sign', 'role', 'active', 'created_at'],
  cases: ['id', 'reference', 'title', 'description', 'status', 'reporter_id', 'assignee_id', 'reported_lat', 'reported_lon', 'bands', 'report', 'consent_share_name', 'outcome', 'level_before_dbm', 'level_after_dbm', 'created_at', 'updated_at', 'resolved_at', 'merged_into'],
  case_events: ['id', 'case_id', 'actor_id', 'kind', 'data', 'visibility', 'created_at'],
  bearings: ['id', 'case_id', 'author_id', 'lat', 'lon', 'position_source', 'position_accuracy_m', 'azimuth_entered_deg', 'reference', 'declination_deg', 'azimuth_true_deg', 'sigma_deg', 'null_width_deg', 'frequency_khz', 'one_way', 'note', 'excluded', 'taken_at'],
  fix_snapshots: ['id', 'case_id', 'cause', 'line_count', 'ok', 'lat', 'lon', 'semi_major_m', 'semi_minor_m', 'major_axis_azimuth_deg', 'created_at'],
  notices: ['id', 'case_id', 'template_key', 'status', 'recipient_name', 'postal_address', 'email', 'sent_at', 'delivered_on', 'created_at'],
  notice_answers: ['id', 'notice_id', 'kind', 'message', 'contact', 'created_at'],
  notice_templates: ['key', 'title', 'subject', 'body', 'version', 'updated_at'],
  case_levels: ['id', 'case_id', 'client_id', 'author_id', 'frequency_khz', 'level_unit', 'level_value', 'over_s9_db', 'level_dbm', 'bandwidth_hz', 'taken_at', 'lat', 'lon', 'phase', 'created_at'],
  level_readings: ['id', 'case_id', 'author_id', 'client_id', 'source', 'lat', 'lon', 'accuracy_m', 'level_unit', 'level_value', 'level_dbm', 'frequency_khz', 'note', 'taken_at', 'created_at'],
};

/** One table of the club export, in key order, a thousand rows at a time. */
export async function* clubTableBatches(table: keyof typeof CLUB_EXPORT_TABLES & string, q: Knex = db): AsyncGenerator<Record<string, unknown>[]> {
  const columns = CLUB_EXPORT_TABLES[table];
  const key = columns[0];
  let after: unknown = null;
  for (;;) {
    const b = q(table).select(columns).orderBy(key).limit(BATCH);
    if (after !== null) b.where(key, '>', after as string);
    const rows = await b;
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < BATCH) return;
    after = rows[rows.length - 1][key];
  }
}
