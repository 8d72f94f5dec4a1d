import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { caseCandidates } from '@/lib/hunt/candidates';
import { forbidden } from '@/lib/errors';

/**
 * The buildings inside the current fix's 95 % region, most likely first. Linking a case to a
 * house is personal data: the committee and the assigned hunter only.
 */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('Candidate houses are for the committee and the assigned hunter.');
  return json(await caseCandidates(id));
});
