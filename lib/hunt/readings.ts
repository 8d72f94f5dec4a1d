import type { Knex } from 'knex';
import type { z } from 'zod';
import { findLevelReadingByClientId, getLevelReading, insertLevelReading, type LevelReadingWithAuthor } from '@/db/level-readings';
import { getProfile } from '@/db/users';
import type { CaseRow, User } from '@/db/types';
import { sUnitsToDbm, trailPeak, type TrailPeak } from '@/lib/df';
import { badRequest, conflict, forbidden } from '@/lib/errors';
import { SurveyRefused, walkedSurvey, type SurveyPoint, type SurveyProblem } from '@/lib/survey/walked-survey';
import { strongestPoint } from '@/lib/survey/strongest-point';
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

/** 403 unless the user may add readings (walk or survey) to this case now: the committee or the assigned hunter, while it is hunted. */
export function assertMayAddReadings(user: User, row: CaseRow): void {
  if (!caseAccess(user, row).hunt) throw forbidden('Only the assigned hunter or a coordinator can add readings to this case, while it is being hunted.');
}

/**
 * Stores one level reading of the walk. A repeat of an item already stored (same clientId) answers
 * the stored row and stores nothing (`repeat: true`), so a retried send never makes a second one.
 * Call with the case row locked (`lockVisibleCase`), which also serialises retries racing each other.
 */
export async function addLevelReading(trx: Knex.Transaction, user: User, row: CaseRow, input: ReadingInput): Promise<{ reading: LevelReadingView; repeat: boolean }> {
  const before = sameItemOrConflict(await findLevelReadingByClientId(input.clientId, trx), user, row.id);
  if (before) return { reading: toLevelReadingView(before), repeat: true };
  assertMayAddReadings(user, row);
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

type SurveyInput = { gpx: string; csv?: string; toleranceS: number; frequencyKhz?: number };

/** At most this many problems are listed in one answer (the count says how many there were). */
const MAX_LISTED_PROBLEMS = 100;

/** What a survey would add to the trail: counts, time span, strongest raw reading and smoothed peak. */
export type SurveySummary = {
  points: number;
  unmatchedCsvRows: number[];
  toleranceS: number;
  span: { from: string; to: string } | null;
  strongest: { lat: number; lon: number; level: { unit: 'S' | 'dBm'; value: number }; levelDbm: number; takenAt: string } | null;
  peak: ReturnType<typeof trailPeakView>;
};

type CheckedSurvey = { summary: SurveySummary; rows: (SurveyPoint & { levelDbm: number })[] } | { problems: SurveyProblem[]; problemCount: number };

/**
 * Reads the files and converts every level to dBm as the import would store it (the caller's
 * S-meter offset removed), writing nothing: either the points and their summary, or every
 * problem found (GPX line, CSV row), the first MAX_LISTED_PROBLEMS of them listed.
 */
async function checkSurvey(q: Knex, user: User, row: CaseRow, input: SurveyInput): Promise<CheckedSurvey> {
  assertMayAddReadings(user, row);
  let survey;
  try {
    survey = walkedSurvey(input.gpx, input.csv, input.toleranceS);
  } catch (err) {
    if (!(err instanceof SurveyRefused)) throw err;
    return { problems: err.problems.slice(0, MAX_LISTED_PROBLEMS), problemCount: err.problems.length };
  }
  if (!survey.points.length) {
    const message = `No level in the CSV lies within ${input.toleranceS} s of a track point: check the clocks or widen the tolerance.`;
    return { problems: [{ file: 'csv', message }], problemCount: 1 };
  }
  const offset = (await getProfile(user.id, q))?.sMeterOffsetDb ?? 0;
  const rows = survey.points.map((p) => ({ ...p, levelDbm: readingDbm(p.level, input.frequencyKhz, offset) }));
  const times = rows.map((p) => p.takenAt.getTime());
  const top = strongestPoint(rows, (p) => p.levelDbm);
  // The smoothed peak walks the points in the order taken, as the trail is drawn.
  const inOrder = [...rows].sort((a, b) => a.takenAt.getTime() - b.takenAt.getTime());
  return {
    rows,
    summary: {
      points: rows.length,
      unmatchedCsvRows: survey.unmatched,
      toleranceS: survey.toleranceS,
      span: { from: new Date(Math.min(...times)).toISOString(), to: new Date(Math.max(...times)).toISOString() },
      strongest: top && { lat: top.lat, lon: top.lon, level: top.level, levelDbm: top.levelDbm, takenAt: top.takenAt.toISOString() },
      peak: trailPeakView(inOrder),
    },
  };
}

/** The dry run of a survey import: what would be stored, or every problem, and nothing written. */
export async function previewSurvey(q: Knex, user: User, row: CaseRow, input: SurveyInput): Promise<{ dryRun: true; ok: boolean; problems: SurveyProblem[]; problemCount: number } & Partial<SurveySummary>> {
  const r = await checkSurvey(q, user, row, input);
  if ('problems' in r) return { dryRun: true, ok: false, problems: r.problems, problemCount: r.problemCount };
  return { dryRun: true, ok: true, problems: [], problemCount: 0, ...r.summary };
}

/**
 * A walked survey imported from GPX (+ CSV) into the same trail as walked readings (source 'gpx'):
 * all points or none, in one transaction; answers the count, the levels left out, the time span,
 * the strongest reading and the smoothed peak. Any problem: 400 listing them, nothing stored.
 */
export async function importSurvey(trx: Knex.Transaction, user: User, row: CaseRow, input: SurveyInput): Promise<{ imported: number } & SurveySummary> {
  const r = await checkSurvey(trx, user, row, input);
  if ('problems' in r) {
    const first = r.problems[0].message;
    throw badRequest(r.problemCount > 1 ? `${first} (${r.problemCount} problems in all; nothing was imported)` : first, { problems: r.problems, problemCount: r.problemCount });
  }
  for (const p of r.rows) {
    await insertLevelReading(trx, row.id, user.id, {
      clientId: null,
      source: 'gpx',
      lat: p.lat,
      lon: p.lon,
      accuracyM: null,
      levelUnit: p.level.unit,
      levelValue: p.level.value,
      levelDbm: p.levelDbm,
      frequencyKhz: input.frequencyKhz ?? null,
      note: '',
      takenAt: p.takenAt,
    });
  }
  return { imported: r.rows.length, ...r.summary };
}
