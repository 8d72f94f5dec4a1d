import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listBearings } from '@/db/bearings';
import { getClubSettings } from '@/db/settings';
import { bearingInputSchema } from '@/lib/validation/bearings';
import { caseIdSchema, loadVisibleCase, lockVisibleCase } from '@/lib/hunt/case-detail';
import { addBearing } from '@/lib/hunt/bearings';
import { bearingWithFix } from '@/lib/hunt/fix';
import { toBearingView } from '@/lib/hunt/to-view';
import { forbidden } from '@/lib/errors';

/** Every bearing of the case, excluded ones too (they are never deleted). */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('Bearings are for the committee and the assigned hunter.');
  const items = (await listBearings(id)).map(toBearingView);
  return json({ items, total: items.length, page: 1, pageSize: items.length });
});

/** Adds a bearing; the fix is recomputed and a snapshot kept, in the same transaction. A repeat of the same clientId answers 200 with the stored bearing. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  const saved = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    return addBearing(trx, me, row, await getClubSettings(trx), bearingInputSchema.parse(body));
  });
  return json(await bearingWithFix(id, saved.id), saved.repeat ? 200 : 201);
});
