import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { transitionSchema } from '@/lib/validation/cases';
import { caseIdSchema, lockVisibleCase, toCaseDetail } from '@/lib/hunt/case-detail';
import { applyTransition } from '@/lib/hunt/transitions';

/**
 * Moves a case along open -> located -> notified -> resolved (or back to open), checking who,
 * from which state and with what evidence (lib/hunt/transitions.ts). 409 on a stale version,
 * 422 when the evidence is not there yet.
 */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  const row = await inTransaction(async (trx) => {
    const { row: current } = await lockVisibleCase(trx, me, id);
    await applyTransition(trx, me, current, transitionSchema.parse(body));
    return (await lockVisibleCase(trx, me, id)).row;
  });
  return json(await toCaseDetail(me, row));
});
