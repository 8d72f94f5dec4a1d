import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getClubSettings } from '@/db/settings';
import { sweepInputSchema } from '@/lib/validation/bearings';
import { caseIdSchema, lockVisibleCase } from '@/lib/hunt/case-detail';
import { addSweep } from '@/lib/hunt/bearings';
import { bearingWithFix } from '@/lib/hunt/fix';

/** A rotation sweep (loop-axis angle and level readings) becomes a bearing through lib/df fitNullSweep; a repeat of the same clientId answers 200 with the stored one. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  const saved = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    return addSweep(trx, me, row, await getClubSettings(trx), sweepInputSchema.parse(body));
  });
  return json({ ...(await bearingWithFix(id, saved.id)), sweepFit: saved.sweepFit }, saved.repeat ? 200 : 201);
});
