import { DOMParser } from '@xmldom/xmldom';
import { gpx } from '@tmcw/togeojson';
import Papa from 'papaparse';

/**
 * A walked survey from files: a GPX 1.1 track (read with @tmcw/togeojson on an @xmldom/xmldom
 * document) whose points carry a level in an extension (<level unit="S|dBm">7</level>, any
 * namespace), or a GPX track plus a CSV of timed levels (columns time, level, unit) joined by
 * time: each level takes the track position nearest in time, within a stated tolerance. Pure:
 * text in, points out; every refusal names where (line and column, CSV row), and a refusal
 * lists every bad point and row it found, not only the first.
 */

/** One thing wrong with the files: which file, where in it (GPX line, CSV row) and what, in plain words. */
export type SurveyProblem = { file: 'gpx' | 'csv'; line?: number; row?: number; message: string };

export class SurveyRefused extends Error {
  readonly problems: SurveyProblem[];
  constructor(problems: SurveyProblem[] | SurveyProblem) {
    const list = Array.isArray(problems) ? problems : [problems];
    super(list.length > 1 ? `${list[0].message} (${list.length} problems in all)` : list[0].message);
    this.name = 'SurveyRefused';
    this.problems = list;
  }
}

export type SurveyPoint = { lat: number; lon: number; takenAt: Date; level: { unit: 'S' | 'dBm'; value: number } };
type TrackPoint = { lat: number; lon: number; t: number; level?: SurveyPoint['level'] };

function parseXml(text: string) {
  try {
    return new DOMParser({
      onError: (level, message) => {
        if (level !== 'warning') throw new Error(message);
      },
    }).parseFromString(text, 'text/xml');
  } catch (err) {
    const e = err as { message: string; locator?: { lineNumber?: number; columnNumber?: number } };
    const where = e.locator?.lineNumber ? ` at line ${e.locator.lineNumber}, column ${e.locator.columnNumber}` : '';
    throw new SurveyRefused({ file: 'gpx', line: e.locator?.lineNumber || undefined, message: `The GPX is not well-formed XML${where}: ${e.message.replace(/^.*caused Error: /, '')}.` });
  }
}

function unitOf(u: string | null): 'S' | 'dBm' {
  return u && /^dbm$/i.test(u) ? 'dBm' : 'S';
}

const attrNumber = (v: string | null) => (v === null || v.trim() === '' ? NaN : Number(v));

/** The track points in order, with times, and a level where an extension carries one. */
export function readGpxTrack(text: string): TrackPoint[] {
  const doc = parseXml(text);
  const root = doc.documentElement;
  if (!root || root.localName !== 'gpx') throw new SurveyRefused({ file: 'gpx', message: `The file is XML but not GPX: its root element is <${root?.localName ?? 'none'}>, not <gpx>.` });
  const trkpts = Array.from(doc.getElementsByTagNameNS('*', 'trkpt'));
  if (!trkpts.length) throw new SurveyRefused({ file: 'gpx', message: 'The GPX has no track points (<trkpt>): export the walk as a track, not a route or waypoints.' });
  // togeojson reads the geometry and times; our own pass reads the level extension of each point.
  const features = gpx(doc as unknown as Document).features.filter((f) => f.geometry?.type === 'LineString' || f.geometry?.type === 'MultiLineString');
  const coords: number[][] = [];
  const times: string[] = [];
  for (const f of features) {
    const g = f.geometry as { type: string; coordinates: number[][] | number[][][] };
    const lines = (g.type === 'LineString' ? [g.coordinates] : g.coordinates) as number[][][];
    const t = (f.properties?.coordinateProperties?.times ?? []) as string[] | string[][];
    lines.forEach((line, i) => {
      coords.push(...line);
      times.push(...((g.type === 'LineString' ? t : t[i]) as string[]));
    });
  }
  const out: TrackPoint[] = [];
  const problems: SurveyProblem[] = [];
  trkpts.forEach((el, i) => {
    const line = (el as unknown as { lineNumber?: number }).lineNumber;
    const at = line ? ` (line ${line})` : '';
    const refuse = (message: string) => problems.push({ file: 'gpx', line, message });
    // togeojson leaves out what a point lacks, so its arrays shift past such a point: when they do
    // not line up with the <trkpt> elements, each point's own attributes and <time> are read.
    const aligned = coords.length === trkpts.length && times.length === trkpts.length;
    const c = aligned ? coords[i] : [attrNumber(el.getAttribute('lon')), attrNumber(el.getAttribute('lat'))];
    const time = aligned ? times[i] : el.getElementsByTagNameNS('*', 'time')[0]?.textContent;
    if (!c || !Number.isFinite(c[0]) || !Number.isFinite(c[1])) return refuse(`Track point ${i + 1}${at} has no valid lat/lon.`);
    const t = time ? Date.parse(time) : NaN;
    if (!Number.isFinite(t)) return refuse(`Track point ${i + 1}${at} has no <time>: a survey needs the time of each point.`);
    const lv = el.getElementsByTagNameNS('*', 'level')[0];
    let level: TrackPoint['level'];
    if (lv) {
      const value = Number(lv.textContent?.trim());
      if (!Number.isFinite(value)) return refuse(`Track point ${i + 1}${at}: its <level> "${lv.textContent}" is not a number.`);
      level = { unit: unitOf(lv.getAttribute('unit')), value };
    }
    out.push({ lon: c[0], lat: c[1], t, level });
  });
  if (problems.length) throw new SurveyRefused(problems);
  return out;
}

export type CsvLevel = { t: number; level: SurveyPoint['level']; row: number };

/** A CSV of timed levels: header time,level[,unit]; ISO 8601 times; unit S (default) or dBm. */
export function readLevelCsv(text: string): CsvLevel[] {
  const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true, skipEmptyLines: true, transformHeader: (h) => h.trim().toLowerCase() });
  const fields = parsed.meta.fields ?? [];
  if (!fields.includes('time') || !fields.includes('level')) throw new SurveyRefused({ file: 'csv', row: 1, message: `The CSV needs the columns time and level (and optionally unit); its header is "${fields.join(',')}".` });
  if (parsed.errors.length) {
    throw new SurveyRefused(parsed.errors.map((e) => ({ file: 'csv' as const, row: (e.row ?? 0) + 2, message: `CSV row ${(e.row ?? 0) + 2}: ${e.message}.` })));
  }
  const levels: CsvLevel[] = [];
  const problems: SurveyProblem[] = [];
  parsed.data.forEach((r, i) => {
    const row = i + 2; // the header is line 1
    const refuse = (message: string) => problems.push({ file: 'csv', row, message: `CSV row ${row}: ${message}` });
    const t = Date.parse(r.time ?? '');
    if (!Number.isFinite(t)) return refuse(`"${r.time}" is not a time (use ISO 8601, e.g. 2026-11-30T14:05:10Z).`);
    const value = Number(r.level);
    if (r.level === undefined || r.level.trim() === '' || !Number.isFinite(value)) return refuse(`the level "${r.level ?? ''}" is not a number.`);
    const u = (r.unit ?? '').trim();
    if (u && !/^(s|dbm)$/i.test(u)) return refuse(`the unit "${u}" is neither S nor dBm.`);
    levels.push({ t, level: { unit: unitOf(u || null), value }, row });
  });
  if (problems.length) throw new SurveyRefused(problems);
  return levels;
}

/**
 * Joins levels to the track by time: each level takes the track point nearest in time when it
 * is within `toleranceS` seconds (else it is left out and counted). Track and levels in any order.
 */
export function joinByTime(track: TrackPoint[], levels: CsvLevel[], toleranceS: number): { points: SurveyPoint[]; unmatched: number[] } {
  const sorted = [...track].sort((a, b) => a.t - b.t);
  const points: SurveyPoint[] = [];
  const unmatched: number[] = [];
  for (const l of levels) {
    let lo = 0;
    let hi = sorted.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sorted[mid].t < l.t) lo = mid + 1;
      else hi = mid;
    }
    const best = [sorted[lo - 1], sorted[lo]].filter(Boolean).reduce((a, b) => (Math.abs(b.t - l.t) < Math.abs(a.t - l.t) ? b : a));
    if (Math.abs(best.t - l.t) <= toleranceS * 1000) points.push({ lat: best.lat, lon: best.lon, takenAt: new Date(l.t), level: l.level });
    else unmatched.push(l.row);
  }
  return { points, unmatched };
}

/** The whole import: GPX alone (levels in extensions) or GPX + CSV joined within the tolerance. */
export function walkedSurvey(gpxText: string, csvText?: string, toleranceS = 5): { points: SurveyPoint[]; unmatched: number[]; toleranceS: number } {
  // Both files are read before refusing, so one answer names the problems of both.
  const problems: SurveyProblem[] = [];
  const attempt = <T>(read: () => T): T | undefined => {
    try {
      return read();
    } catch (err) {
      if (!(err instanceof SurveyRefused)) throw err;
      problems.push(...err.problems);
    }
  };
  const track = attempt(() => readGpxTrack(gpxText));
  const levels = csvText === undefined ? undefined : attempt(() => readLevelCsv(csvText));
  if (!track || problems.length) throw new SurveyRefused(problems);
  if (levels) return { ...joinByTime(track, levels, toleranceS), toleranceS };
  const points = track.filter((p) => p.level).map((p) => ({ lat: p.lat, lon: p.lon, takenAt: new Date(p.t), level: p.level! }));
  if (!points.length) throw new SurveyRefused({ file: 'gpx', message: 'No track point carries a <level> extension: add the CSV of timed levels.' });
  return { points, unmatched: [], toleranceS };
}

export { strongestPoint } from './strongest-point';
