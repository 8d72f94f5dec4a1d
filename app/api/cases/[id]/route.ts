import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { appendEvent, writeCase } from '@/db/cases';
import { assignLockedCase } from '@/lib/hunt/assign';
import { casePatchSchema } from '@/lib/validation/cases';
import { caseIdSchema, loadVisibleCase, lockVisibleCase, toCaseDetail } from '@/lib/hunt/case-detail';
import { assertVersion } from '@/lib/hunt/stale';

export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { row } = await loadVisibleCase(me, id);
  return json(await toCaseDetail(me, row));
});

/** Coordinators: assign, or edit the title and description. One transaction with its timeline entry. */
export const PATCH = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator');
  const patch = casePatchSchema.parse(await readJson(req));
  const row = await inTransaction(async (trx) => {
    const { row: current } = await lockVisibleCase(trx, me, id);
    await assertVersion(trx, current, patch.version);
    if (patch.assigneeId !== undefined) await assignLockedCase(trx, me, current, patch.assigneeId);
    const edits = { title: patch.title, description: patch.description };
    if (Object.values(edits).some((v) => v !== undefined)) {
      await writeCase(trx, id, edits);
      const fields = Object.keys(edits).filter((k) => edits[k as keyof typeof edits] !== undefined);
      await appendEvent(trx, { caseId: id, actorId: me.id, kind: 'edited', data: { fields, before: { title: current.title, description: current.description } } });
    }
    return (await lockVisibleCase(trx, me, id)).row;
  });
  return json(await toCaseDetail(me, row));
});
