import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listLevelReadings } from '@/db/level-readings';
import { readingInputSchema } from '@/lib/validation/readings';
import { caseIdSchema, loadVisibleCase, lockVisibleCase } from '@/lib/hunt/case-detail';
import { addLevelReading, toLevelReadingView, trailPeakView } from '@/lib/hunt/readings';
import { forbidden } from '@/lib/errors';

/** The walked level trail in the order it was taken, with its smoothed peak (lib/df trailPeak). */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('Level readings are for the committee and the assigned hunter.');
  const items = (await listLevelReadings(id)).map(toLevelReadingView);
  return json({ items, total: items.length, page: 1, pageSize: items.length, peak: trailPeakView(items) });
});

/** One level reading of the walk; a repeat of the same clientId answers 200 with the stored row. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  const { reading, repeat } = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    return addLevelReading(trx, me, row, readingInputSchema.parse(body));
  });
  return json({ reading }, repeat ? 200 : 201);
});
