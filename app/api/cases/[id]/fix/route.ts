import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { fixView } from '@/lib/hunt/fix';
import { forbidden } from '@/lib/errors';

/** The current fix (lib/df estimateFix over the active bearings), its trail, next spots and warnings. */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden('The fix is for the committee and the assigned hunter.');
  return json(await fixView(id));
});
