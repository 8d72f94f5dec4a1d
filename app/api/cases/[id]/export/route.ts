import { z } from 'zod';
import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { listBearings } from '@/db/bearings';
import { latestFixSnapshot } from '@/db/fixes';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { caseGeoJson } from '@/lib/export/case-geojson';
import { bearingsCsv, CONTENT_TYPES, EXPORT_FORMATS, toKml } from '@/lib/export/formats';
import { forbidden } from '@/lib/errors';

const formatSchema = z.object({ format: z.enum(EXPORT_FORMATS).default('geojson') });

/** One case's lines, fix and region as GeoJSON or KML, or its bearings as CSV: committee and the assigned hunter. */
export const GET = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { format } = formatSchema.parse({ format: req.nextUrl.searchParams.get('format') ?? undefined });
  const { row, access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('Exports of the hunt are for the committee and the assigned hunter.');
  const [bearings, snapshot] = await Promise.all([listBearings(id), latestFixSnapshot(id)]);
  const file = `${row.reference}.${format}`;
  const body =
    format === 'csv' ? bearingsCsv(bearings) : format === 'kml' ? toKml(caseGeoJson(row, bearings, snapshot?.result), row.reference) : JSON.stringify(caseGeoJson(row, bearings, snapshot?.result));
  return new NextResponse(body, {
    headers: { 'content-type': CONTENT_TYPES[format], 'content-disposition': `attachment; filename="${file}"`, 'cache-control': 'no-store' },
  });
});
