import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { mergeSchema } from '@/lib/validation/cases';
import { caseIdSchema, toCaseDetail } from '@/lib/hunt/case-detail';
import { mergeInto } from '@/lib/hunt/merge';

/** Coordinators: merge this (newer) case into an older one; answers with the older case. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator');
  const { intoCaseId, version } = mergeSchema.parse(await readJson(req));
  const target = await inTransaction((trx) => mergeInto(trx, me, id, intoCaseId, version));
  return json(await toCaseDetail(me, target));
});
