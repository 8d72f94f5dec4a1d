import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { lockCase } from '@/db/cases';
import { listLevelReadings } from '@/db/level-readings';
import { readingInputSchema } from '@/lib/validation/readings';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
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
  await loadVisibleCase(me, id);
  const input = readingInputSchema.parse(await readJson(req));
  const { reading, repeat } = await inTransaction(async (trx) => addLevelReading(trx, me, (await lockCase(trx, id))!, input));
  return json({ reading }, repeat ? 200 : 201);
});
