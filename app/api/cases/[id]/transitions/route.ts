import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { lockCase } from '@/db/cases';
import { transitionSchema } from '@/lib/validation/cases';
import { caseIdSchema, loadVisibleCase, toCaseDetail } from '@/lib/hunt/case-detail';
import { applyTransition } from '@/lib/hunt/transitions';

/**
 * Moves a case along open -> located -> notified -> resolved (or back to open), checking who,
 * from which state and with what evidence (lib/hunt/transitions.ts). 409 on a stale version,
 * 422 when the evidence is not there yet.
 */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  await loadVisibleCase(me, id);
  const t = transitionSchema.parse(await readJson(req));
  const row = await inTransaction(async (trx) => {
    const current = (await lockCase(trx, id))!;
    await applyTransition(trx, me, current, t);
    return (await lockCase(trx, id))!;
  });
  return json(await toCaseDetail(me, row));
});
