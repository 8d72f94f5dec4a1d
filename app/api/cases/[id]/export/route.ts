import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { exportParamsSchema } from '@/lib/validation/exports';
import { requireUser } from '@/lib/auth/session';
import { listBearings } from '@/db/bearings';
import { latestFixSnapshot } from '@/db/fixes';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { caseGeoJson } from '@/lib/export/case-geojson';
import { bearingsCsv, CONTENT_TYPES, csvDownload, levelCsvChunks, toKml } from '@/lib/export/formats';
import { caseLevelBatches } from '@/db/exports';
import { getClubSettings } from '@/db/settings';
import { forbidden } from '@/lib/errors';

const formatSchema = exportParamsSchema(['bearings', 'levels']);

/**
 * One case's lines, fix and region as GeoJSON or KML, or as CSV its bearings (`what=bearings`,
 * the default) or its level log (`what=levels`, streamed): committee and the assigned hunter.
 */
export const GET = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { format, what } = formatSchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  const { row, access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('Exports of the hunt are for the committee and the assigned hunter.');
  if (what === 'levels') {
    const { noiseEnvironment: environment } = await getClubSettings();
    return csvDownload(`${row.reference}-levels.csv`, levelCsvChunks(caseLevelBatches(me, id), environment, false));
  }
  const [bearings, snapshot] = await Promise.all([listBearings(id), latestFixSnapshot(id)]);
  const file = `${row.reference}.${format}`;
  const body =
    format === 'csv' ? bearingsCsv(bearings) : format === 'kml' ? toKml(caseGeoJson(row, bearings, snapshot?.result), row.reference) : JSON.stringify(caseGeoJson(row, bearings, snapshot?.result));
  return new NextResponse(body, {
    headers: { 'content-type': CONTENT_TYPES[format], 'content-disposition': `attachment; filename="${file}"`, 'cache-control': 'no-store' },
  });
});
