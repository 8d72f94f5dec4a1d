import { z } from 'zod';
import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getBearing } from '@/db/bearings';
import { getClubSettings } from '@/db/settings';
import { bearingPatchSchema } from '@/lib/validation/bearings';
import { lockVisibleCase } from '@/lib/hunt/case-detail';
import { editBearing } from '@/lib/hunt/bearings';
import { bearingWithFix } from '@/lib/hunt/fix';
import { notFound } from '@/lib/errors';

const paramsSchema = z.object({ id: z.uuid(), bearingId: z.uuid() });

/** Edit, exclude or include a bearing (its author or a coordinator); the previous state is kept. */
export const PATCH = route<{ id: string; bearingId: string }>(async (req, ctx) => {
  const { id, bearingId } = paramsSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    const patch = bearingPatchSchema.parse(body);
    const before = await getBearing(id, bearingId, trx);
    if (!before) throw notFound('No such bearing on this case.');
    await editBearing(trx, me, row, await getClubSettings(trx), before, patch);
  });
  return json(await bearingWithFix(id, bearingId));
});
