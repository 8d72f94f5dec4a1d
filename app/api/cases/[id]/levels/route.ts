import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { db, inTransaction } from '@/db';
import { getClubSettings } from '@/db/settings';
import { forbidden } from '@/lib/errors';
import { addLevel, levelLog } from '@/lib/levels/service';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { levelReadingSchema } from '@/lib/validation/levels';

const PRIVATE = 'The level log is for the committee and the assigned hunter.';

/** The level log with each reading's expected floor and excess, and the before/after difference: committee and assigned hunter. */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden(PRIVATE);
  return json(await levelLog(db, id, (await getClubSettings()).noiseEnvironment));
});

/** Log one reading (a repeated clientId returns the stored one with 200). */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden(PRIVATE);
  const input = levelReadingSchema.parse(await readJson(req));
  const r = await inTransaction((trx) => addLevel(trx, me, id, input));
  return json({ item: r.item }, r.created ? 201 : 200);
});
