import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { appendEvent } from '@/db/cases';
import { commentSchema } from '@/lib/validation/cases';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { toEventView } from '@/lib/hunt/to-view';
import { forbidden } from '@/lib/errors';

/**
 * Anyone who can see the case comments on it. A comment is visible to the reporter too, unless it
 * carries a hunter's "premises confirmed" note, which stays with the committee.
 */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const c = commentSchema.parse(await readJson(req));
  if (c.premisesConfirmed && !access.seeHunt) throw forbidden('Only the assigned hunter or the committee can confirm premises.');
  const event = await inTransaction((trx) =>
    appendEvent(trx, {
      caseId: id,
      actorId: me.id,
      kind: 'comment',
      data: { text: c.text, premisesConfirmed: c.premisesConfirmed },
      visibility: c.premisesConfirmed ? 'committee' : 'all',
    }),
  );
  return json(toEventView({ ...event, actorName: me.name }), 201);
});
