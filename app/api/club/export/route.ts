import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { CLUB_EXPORT_TABLES, clubTableBatches } from '@/db/exports';
import { textStream } from '@/lib/export/formats';

/**
 * The whole club as JSON lines (one `{"table", "row"}` object a line, table by table), streamed:
 * admins only. Password hashes and link secrets are never part of it.
 */
export const GET = route(async () => {
  await requireUser('admin');
  async function* lines(): AsyncGenerator<string> {
    yield JSON.stringify({ format: 'quietfix-club-export', version: 1, exportedAt: new Date().toISOString(), tables: Object.keys(CLUB_EXPORT_TABLES) }) + '\n';
    for (const table of Object.keys(CLUB_EXPORT_TABLES)) {
      for await (const rows of clubTableBatches(table)) yield rows.map((row) => JSON.stringify({ table, row })).join('\n') + '\n';
    }
  }
  return new NextResponse(textStream(lines()), {
    headers: { 'content-type': 'application/x-ndjson; charset=utf-8', 'content-disposition': 'attachment; filename="quietfix-club.jsonl"', 'cache-control': 'no-store' },
  });
});
