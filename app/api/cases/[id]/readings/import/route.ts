import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { db, inTransaction } from '@/db';
import { surveyImportSchema } from '@/lib/validation/readings';
import { caseIdSchema, loadVisibleCase, lockVisibleCase } from '@/lib/hunt/case-detail';
import { assertMayAddReadings, importSurvey, previewSurvey } from '@/lib/hunt/readings';

/**
 * Import a walked survey (GPX with levels, or GPX + CSV joined by time) into the case's trail: all
 * or nothing. `?dryRun=1` reads and checks the files and answers what would be stored (counts,
 * time span, strongest reading, smoothed peak) or every problem by GPX line and CSV row (200 with
 * `ok: false`), writing nothing; without it, any problem is a 400 listing them and nothing is stored.
 */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const body = await readJson(req);
  if (req.nextUrl.searchParams.get('dryRun') === '1') {
    const { row } = await loadVisibleCase(me, id);
    assertMayAddReadings(me, row);
    return json(await previewSurvey(db, me, row, surveyImportSchema.parse(body)));
  }
  const r = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    return importSurvey(trx, me, row, surveyImportSchema.parse(body));
  });
  return json(r, 201);
});
