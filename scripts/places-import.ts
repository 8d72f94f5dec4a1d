/**
 * npm run places:import -- FILE [--source NAME]
 * Loads streets and buildings from a GeoJSON (RFC 7946) file or an OpenStreetMap XML export into
 * the places table, in one transaction: a re-import updates, a bad file imports nothing.
 */
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { db } from '../db/index';
import { importPlaceFile } from '../lib/places/import-places';
import { PlaceFileError } from '../lib/places/parse-place-file';

async function main() {
  const args = process.argv.slice(2);
  const at = args.indexOf('--source');
  const source = at >= 0 ? args.splice(at, 2)[1] : undefined;
  const file = args[0];
  if (!file) {
    console.error('usage: npm run places:import -- FILE.geojson|FILE.osm [--source NAME]');
    process.exitCode = 2;
    return;
  }
  let raw: string;
  try {
    raw = await readFile(file, 'utf8');
  } catch (err) {
    console.error(`quietfix: cannot read ${file}: ${(err as Error).message}`);
    process.exitCode = 1;
    return;
  }
  const t0 = performance.now();
  try {
    const r = await db.transaction((trx) => importPlaceFile(trx, basename(file), raw, source));
    console.log(`quietfix: ${basename(file)}: ${r.inserted} new, ${r.updated} updated, ${r.skipped} skipped (not a building or street) in ${Math.round(performance.now() - t0)} ms.`);
  } catch (err) {
    const plain = err instanceof PlaceFileError;
    console.error(`quietfix: ${basename(file)} was not imported (nothing was written): ${plain ? err.message : `database error: ${(err as Error).message}`}`);
    process.exitCode = 1;
  }
}

main().finally(() => db.destroy());
