import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { listEvents } from '@/db/cases';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { toEventView } from '@/lib/hunt/to-view';
import { withoutRecipientDetails } from '@/lib/notices/views';

/**
 * The case timeline, oldest first; a reporter sees the entries meant for them only, and a
 * recipient's name, words and contact stay with the committee.
 */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const events = (await listEvents(id, { includeCommittee: access.seeHunt })).map(toEventView);
  const items = access.committee ? events : events.map(withoutRecipientDetails);
  return json({ items, total: items.length, page: 1, pageSize: items.length });
});
