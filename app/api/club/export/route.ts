import { Readable } from 'node:stream';
import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { clubExportZip } from '@/lib/export/club-zip';

/**
 * The whole club as a ZIP of JSON-lines files, one per table, with manifest.json (schema version,
 * time, rows per file), streamed: admins only. Password hashes and link secrets are never part of it.
 */
export const GET = route(async () => {
  await requireUser('admin');
  const day = new Date().toISOString().slice(0, 10);
  return new NextResponse(Readable.toWeb(clubExportZip()) as ReadableStream<Uint8Array>, {
    headers: { 'content-type': 'application/zip', 'content-disposition': `attachment; filename="quietfix-club-${day}.zip"`, 'cache-control': 'no-store' },
  });
});
