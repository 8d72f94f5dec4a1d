import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { exportParamsSchema } from '@/lib/validation/exports';
import { requireUser } from '@/lib/auth/session';
import { exportCaseBatches, filteredLevelBatches } from '@/db/exports';
import { getClubSettings } from '@/db/settings';
import { parseQueueFilter } from '@/lib/validation/queue';
import { caseCsvRows, caseFeature, CONTENT_TYPES, csvDownload, KML_TAIL, kmlHead, kmlPlacemarks, levelCsvChunks, textStream } from '@/lib/export/formats';

const formatSchema = exportParamsSchema(['cases', 'levels']);

/**
 * The cases matching the queue's filters, streamed a thousand at a time: GeoJSON (a Point per case
 * with a position), KML, or CSV of the queue's columns (`what=cases`, the default) or of those
 * cases' level logs (`what=levels`, a case_reference column first). Committee only.
 */
export const GET = route(async (req) => {
  const me = await requireUser('admin', 'coordinator');
  const sp = req.nextUrl.searchParams;
  const { format, what } = formatSchema.parse(Object.fromEntries(sp));
  const filter = parseQueueFilter(sp);
  if (what === 'levels') {
    const { noiseEnvironment: environment } = await getClubSettings();
    return csvDownload('quietfix-levels.csv', levelCsvChunks(filteredLevelBatches(me, filter), environment, true));
  }
  async function* chunks(): AsyncGenerator<string> {
    let first = true;
    if (format === 'geojson') yield '{"type":"FeatureCollection","features":[';
    if (format === 'kml') yield kmlHead('Quietfix cases');
    for await (const rows of exportCaseBatches(me, filter)) {
      if (format === 'csv') yield caseCsvRows(rows, first);
      else {
        const features = rows.map(caseFeature).filter((f) => f !== null);
        if (format === 'kml') yield kmlPlacemarks(features);
        else if (features.length) yield (first ? '' : ',') + features.map((f) => JSON.stringify(f)).join(',');
        if (features.length) first = false;
        continue;
      }
      first = false;
    }
    if (format === 'csv' && first) yield caseCsvRows([], true);
    if (format === 'geojson') yield ']}';
    if (format === 'kml') yield KML_TAIL;
  }
  return new NextResponse(textStream(chunks()), {
    headers: { 'content-type': CONTENT_TYPES[format], 'content-disposition': `attachment; filename="quietfix-cases.${format}"`, 'cache-control': 'no-store' },
  });
});
