import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { surveyImportSchema } from '@/lib/validation/readings';
import { caseIdSchema, lockVisibleCase } from '@/lib/hunt/case-detail';
import { importSurvey } from '@/lib/hunt/readings';

/** Import a walked survey (GPX with levels, or GPX + CSV joined by time) into the case's trail: all or nothing. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  const r = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    return importSurvey(trx, me, row, surveyImportSchema.parse(body));
  });
  return json(r, 201);
});
