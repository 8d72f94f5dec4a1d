import { NextResponse } from 'next/server';
import tokml from 'tokml';
import { stringify } from 'csv-stringify/sync';
import type { Feature, FeatureCollection, Geometry } from 'geojson';
import type { ExportCaseRow, ExportLevelRow } from '@/db/exports';
import type { NoiseEnvironment } from '@/lib/df';
import { excessOverFloor } from '@/lib/levels/level-log';
import { guardCsvText } from './csv-text';
import type { ExportFormat } from '@/lib/validation/exports';
import type { ExportBearing } from './case-geojson';

export const CONTENT_TYPES: Record<ExportFormat, string> = {
  geojson: 'application/geo+json', // RFC 7946 §12
  kml: 'application/vnd.google-earth.kml+xml; charset=utf-8', // OGC KML 2.2 media type
  csv: 'text/csv; charset=utf-8', // RFC 4180
};

/** KML 2.2 (OGC 07-147r2) through tokml; `name` and `description` properties become the placemark's. */
export const toKml = (fc: FeatureCollection, documentName: string) => tokml(fc, { name: 'name', description: 'description', documentName });

const KML_PLACEMARK = /<Placemark>[\s\S]*?<\/Placemark>/g;
/** The placemarks alone, for writing a long KML document piece by piece. */
export const kmlPlacemarks = (features: Feature[]) => (toKml({ type: 'FeatureCollection', features }, '').match(KML_PLACEMARK) ?? []).join('');
export const kmlHead = (name: string) => `<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document><name>${name.replace(/[<&>]/g, '')}</name>`;
export const KML_TAIL = '</Document></kml>';

export const BEARING_CSV_COLUMNS = ['taken_at', 'lat', 'lon', 'azimuth_deg', 'reference', 'azimuth_true_deg', 'sigma_deg', 'frequency_khz', 'one_way', 'excluded', 'author', 'note'] as const;

/** A case's bearings as CSV (RFC 4180); the columns the bearings import reads back. */
export function bearingsCsv(bearings: ExportBearing[]): string {
  return stringify(
    bearings.map((b) => [new Date(b.takenAt).toISOString(), b.lat, b.lon, b.azimuthEnteredDeg, b.reference, b.azimuthTrueDeg, b.sigmaDeg, b.frequencyKhz ?? '', b.oneWay, b.excluded, guardCsvText(b.authorName), guardCsvText(b.note)]),
    { header: true, columns: [...BEARING_CSV_COLUMNS], cast: { boolean: (v) => String(v) } },
  );
}

export const CASE_CSV_COLUMNS = ['reference', 'title', 'status', 'bands', 'created_at', 'last_activity_at', 'hunter', 'lat', 'lon', 'fix_size_m', 'notices', 'outcome', 'level_before_dbm', 'level_after_dbm'] as const;

export function caseCsvRows(rows: ExportCaseRow[], header: boolean): string {
  return stringify(
    rows.map((r) => [r.reference, guardCsvText(r.title), r.status, r.bands.join(' '), new Date(r.createdAt).toISOString(), new Date(r.lastActivityAt).toISOString(), guardCsvText(r.assigneeName), r.lat ?? '', r.lon ?? '', r.fixSizeM ?? '', r.noticeCount, r.outcome ?? '', r.levelBeforeDbm ?? '', r.levelAfterDbm ?? '']),
    { header, columns: [...CASE_CSV_COLUMNS] },
  );
}

/** The level log's CSV columns, units in the names (kHz, dBm, Hz, dB); taken_at is ISO 8601 UTC. */
export const LEVEL_CSV_COLUMNS = ['taken_at', 'frequency_khz', 'level_dbm', 'bandwidth_hz', 'expected_dbm', 'excess_db', 'phase', 'lat', 'lon'] as const;

/**
 * Level-log readings as CSV rows (RFC 4180), each with the expected man-made noise in its
 * bandwidth for the club's environment (ITU-R P.372, lib/levels) and the excess over it. A set
 * export (`withCase`) starts each row with the case's reference.
 */
export function levelCsvRows(rows: ExportLevelRow[], o: { header: boolean; environment: NoiseEnvironment; withCase: boolean }): string {
  return stringify(
    rows.map((r) => {
      const e = excessOverFloor(o.environment, r.frequencyKhz, r.bandwidthHz, r.levelDbm);
      const cells = [new Date(r.takenAt).toISOString(), r.frequencyKhz, e.levelDbm, r.bandwidthHz, e.expectedDbm, e.excessDb, r.phase, r.lat ?? '', r.lon ?? ''];
      return o.withCase ? [guardCsvText(r.caseReference), ...cells] : cells;
    }),
    { header: o.header, columns: o.withCase ? ['case_reference', ...LEVEL_CSV_COLUMNS] : [...LEVEL_CSV_COLUMNS] },
  );
}

/** Level-log batches as CSV text chunks, the header first (alone when there are no readings). */
export async function* levelCsvChunks(batches: AsyncGenerator<ExportLevelRow[]>, environment: NoiseEnvironment, withCase: boolean): AsyncGenerator<string> {
  let header = true;
  for await (const rows of batches) {
    yield levelCsvRows(rows, { header, environment, withCase });
    header = false;
  }
  if (header) yield levelCsvRows([], { header, environment, withCase });
}

/** A streamed CSV download. */
export const csvDownload = (file: string, chunks: AsyncGenerator<string>) =>
  new NextResponse(textStream(chunks), { headers: { 'content-type': CONTENT_TYPES.csv, 'content-disposition': `attachment; filename="${file}"`, 'cache-control': 'no-store' } });

/** One case of a set export as a GeoJSON Point feature (no point without a position). */
export function caseFeature(r: ExportCaseRow): Feature<Geometry> | null {
  if (r.lat === null || r.lon === null) return null;
  return {
    type: 'Feature',
    id: r.id,
    geometry: { type: 'Point', coordinates: [Math.round(Number(r.lon) * 1e7) / 1e7, Math.round(Number(r.lat) * 1e7) / 1e7] },
    properties: { name: r.reference, description: r.title, reference: r.reference, title: r.title, status: r.status, bands: r.bands, hunter: r.assigneeName, fixSizeM: r.fixSizeM, notices: r.noticeCount, outcome: r.outcome },
  };
}

/** An async generator of text chunks as a web stream (what a route handler returns). */
export function textStream(chunks: AsyncGenerator<string>): ReadableStream<Uint8Array> {
  const enc = new TextEncoder();
  return new ReadableStream({
    async pull(controller) {
      try {
        const { value, done } = await chunks.next();
        if (done) controller.close();
        else controller.enqueue(enc.encode(value));
      } catch (err) {
        console.error('[quietfix] export stream failed:', err);
        controller.error(err);
      }
    },
    async cancel() {
      await chunks.return(undefined);
    },
  });
}
