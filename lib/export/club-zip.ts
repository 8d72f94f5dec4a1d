import { Readable } from 'node:stream';
import { ZipFile } from 'yazl';
import { CLUB_EXPORT_TABLES, clubTableBatches } from '@/db/exports';

/** The layout of the club export; raise it when a file's columns change meaning. */
export const CLUB_EXPORT_SCHEMA_VERSION = 2;

export type ClubExportManifest = {
  format: 'quietfix-club-export';
  schemaVersion: number;
  exportedAt: string;
  /** per file in the zip: the table it holds and its rows (one JSON object a line) */
  files: Record<string, { table: string; rows: number }>;
};

/**
 * The whole club as a ZIP (yazl, streamed): one JSON-lines file per table (`<table>.jsonl`, one
 * row object a line, in key order) and `manifest.json` last, with the schema version, the time
 * and the rows written to each file. yazl pulls one entry at a time, and each entry's stream pulls
 * a thousand rows at a time from the database, so neither the club nor a table sits in memory.
 * Password hashes and link secrets are never selected (CLUB_EXPORT_TABLES).
 */
export function clubExportZip(now = new Date()): Readable {
  const zip = new ZipFile();
  const manifest: ClubExportManifest = { format: 'quietfix-club-export', schemaVersion: CLUB_EXPORT_SCHEMA_VERSION, exportedAt: now.toISOString(), files: {} };
  for (const table of Object.keys(CLUB_EXPORT_TABLES)) {
    const file = `${table}.jsonl`;
    const entry = (manifest.files[file] = { table, rows: 0 });
    async function* lines(): AsyncGenerator<string> {
      for await (const rows of clubTableBatches(table)) {
        entry.rows += rows.length;
        yield rows.map((row) => JSON.stringify(row)).join('\n') + '\n';
      }
    }
    zip.addReadStream(Readable.from(lines()), file, { mtime: now });
  }
  // Read only when yazl reaches it, after every table above was written: the counts are final.
  async function* manifestJson(): AsyncGenerator<string> {
    yield JSON.stringify(manifest, null, 2) + '\n';
  }
  zip.addReadStream(Readable.from(manifestJson()), 'manifest.json', { mtime: now });
  zip.end();
  const out = zip.outputStream as Readable;
  out.on('error', (err) => console.error('[quietfix] club export failed:', err));
  return out;
}
