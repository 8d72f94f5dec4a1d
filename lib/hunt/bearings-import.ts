import { parse } from 'csv-parse/sync';
import { bearingInputSchema } from '@/lib/validation/bearings';
import { badRequest } from '@/lib/errors';
import { trueAzimuth } from './bearing-math';
import { unguardCsvText } from '@/lib/export/csv-text';

/** Rows one import may hold. */
export const IMPORT_MAX_ROWS = 500;

export type ImportProblem = { line: number; field: string; message: string };
export type ImportRow = { line: number; input: ReturnType<typeof bearingInputSchema.parse> };

const NUMBER_COLUMNS = { lat: 'lat', lon: 'lon', azimuth_deg: 'azimuthDeg', sigma_deg: 'sigmaDeg', null_width_deg: 'nullWidthDeg', frequency_khz: 'frequencyKhz', position_accuracy_m: 'positionAccuracyM' } as const;
const TEXT_COLUMNS = { reference: 'reference', quality: 'quality', note: 'note', taken_at: 'takenAt' } as const;
const REQUIRED = ['lat', 'lon', 'azimuth_deg', 'reference'];

/**
 * Bearings from CSV (RFC 4180, a header row; the columns of the bearings export are read back):
 * lat, lon, azimuth_deg, reference (true|magnetic), and optionally sigma_deg, null_width_deg,
 * quality, frequency_khz, one_way, position_accuracy_m, taken_at (ISO 8601), note. Each row is
 * checked with the same schema as a typed bearing; problems name the line and the column.
 */
export function parseBearingsCsv(text: string): { rows: ImportRow[]; problems: ImportProblem[] } {
  let records: Record<string, string>[];
  try {
    records = parse(text, { columns: (h: string[]) => h.map((x) => x.trim().toLowerCase()), skip_empty_lines: true, trim: true, bom: true });
  } catch (err) {
    throw badRequest(`The CSV could not be read: ${(err as Error).message.split('\n')[0]}`);
  }
  if (records.length === 0) throw badRequest('The CSV has no rows under its header.');
  if (records.length > IMPORT_MAX_ROWS) throw badRequest(`One import takes at most ${IMPORT_MAX_ROWS} rows; this file has ${records.length}.`);
  const missing = REQUIRED.filter((c) => !(c in records[0]));
  if (missing.length) throw badRequest(`The header needs the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}.`, { missing });
  const rows: ImportRow[] = [];
  const problems: ImportProblem[] = [];
  records.forEach((r, i) => {
    const line = i + 2; // the header is line 1
    const raw: Record<string, unknown> = { positionSource: 'map', accuracyConfirmed: true };
    for (const [col, key] of Object.entries(NUMBER_COLUMNS)) if (r[col]) raw[key] = Number(r[col]);
    for (const [col, key] of Object.entries(TEXT_COLUMNS)) if (r[col]) raw[key] = unguardCsvText(r[col]);
    if (r.one_way) raw.oneWay = /^(true|yes|1)$/i.test(r.one_way);
    if (raw.positionAccuracyM !== undefined) raw.positionSource = 'device';
    if (typeof raw.takenAt === 'string' && !Number.isNaN(Date.parse(raw.takenAt))) raw.takenAt = new Date(raw.takenAt).toISOString();
    const parsed = bearingInputSchema.safeParse(raw);
    if (parsed.success) rows.push({ line, input: parsed.data });
    else for (const issue of parsed.error.issues) problems.push({ line, field: columnOf(String(issue.path[0] ?? '')), message: issue.message });
  });
  return { rows, problems };
}

const COLUMN_OF: Record<string, string> = Object.fromEntries([...Object.entries(NUMBER_COLUMNS), ...Object.entries(TEXT_COLUMNS), ['one_way', 'oneWay']].map(([c, k]) => [k, c]));
const columnOf = (key: string) => COLUMN_OF[key] ?? key;

/** What a dry run shows for a valid row: the position and the true azimuth it would store. */
export function previewRow(r: ImportRow) {
  const when = r.input.takenAt ? new Date(r.input.takenAt) : new Date();
  return { line: r.line, lat: r.input.lat, lon: r.input.lon, azimuthDeg: r.input.azimuthDeg, reference: r.input.reference, ...trueAzimuth(r.input.azimuthDeg, r.input.reference, r.input.lat, r.input.lon, when) };
}
