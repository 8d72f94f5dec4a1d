import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { lockCase } from '@/db/cases';
import { getClubSettings } from '@/db/settings';
import { sweepInputSchema } from '@/lib/validation/bearings';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { addSweep } from '@/lib/hunt/bearings';
import { bearingWithFix } from '@/lib/hunt/fix';

/** A rotation sweep (loop-axis angle and level readings) becomes a bearing through lib/df fitNullSweep; a repeat of the same clientId answers 200 with the stored one. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  await loadVisibleCase(me, id);
  const input = sweepInputSchema.parse(await readJson(req));
  const settings = await getClubSettings();
  const saved = await inTransaction(async (trx) => addSweep(trx, me, (await lockCase(trx, id))!, settings, input));
  return json({ ...(await bearingWithFix(id, saved.id, settings)), sweepFit: saved.sweepFit }, saved.repeat ? 200 : 201);
});
