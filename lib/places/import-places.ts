import type { Knex } from 'knex';
import { invalidPlaces, upsertPlaces } from '@/db/places';
import { PlaceFileError, parsePlaceFile } from './parse-place-file';

export type PlaceImportResult = { inserted: number; updated: number; skipped: number };

/**
 * Loads one place file into the caller's transaction: everything or nothing. A geometry that
 * PostGIS finds invalid (e.g. a self-crossing outline) fails the import and names its feature.
 */
export async function importPlaceFile(trx: Knex.Transaction, name: string, raw: string, source?: string): Promise<PlaceImportResult> {
  const parsed = parsePlaceFile(name, raw, source);
  if (parsed.places.length === 0) throw new PlaceFileError(`No buildings or streets in the file (${parsed.skipped} other features skipped): nothing imported.`);
  const counts = await upsertPlaces(trx, parsed.places);
  const bySource = new Map<string, string[]>();
  for (const p of parsed.places) bySource.set(p.source, [...(bySource.get(p.source) ?? []), p.sourceId]);
  for (const [src, ids] of bySource) {
    const [bad] = await invalidPlaces(trx, src, ids);
    if (bad) throw new PlaceFileError(`${parsed.labels.get(`${src} ${bad.sourceId}`) ?? bad.sourceId}: the geometry is not valid (${bad.reason}).`);
  }
  return { ...counts, skipped: parsed.skipped };
}
