import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getPremises } from '@/db/premises';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { confirmPremises } from '@/lib/hunt/premises';
import { premisesSchema } from '@/lib/validation/places';
import { forbidden } from '@/lib/errors';

const PRIVATE = 'The premises of a case are for the committee and the assigned hunter.';

/** The confirmed premises (or null): committee and the assigned hunter only. */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden(PRIVATE);
  return json({ premises: await getPremises(id) });
});

/** Confirm (or correct) the premises: a building by placeId, or address + lat/lon; and how. */
export const PUT = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.seeHunt) throw forbidden(PRIVATE);
  const input = premisesSchema.parse(await readJson(req));
  await inTransaction((trx) => confirmPremises(trx, me, id, input));
  return json({ premises: await getPremises(id) });
});
