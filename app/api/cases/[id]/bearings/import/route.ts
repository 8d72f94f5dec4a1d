import { route, json, readText } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getClubSettings } from '@/db/settings';
import { caseIdSchema, loadVisibleCase, lockVisibleCase } from '@/lib/hunt/case-detail';
import { addBearing } from '@/lib/hunt/bearings';
import { parseBearingsCsv, previewRow } from '@/lib/hunt/bearings-import';
import { AppError, forbidden } from '@/lib/errors';

/**
 * Bearings from a CSV body (text/csv). `?dryRun=1` checks every row and shows what would be
 * stored, writing nothing; without it, every row is added in one transaction, or none when any
 * row has a problem (400 with the problems by line and column).
 */
export const POST = route<{ id: string }>({ body: 'raw' }, async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator', 'hunter');
  const { access } = await loadVisibleCase(me, id);
  if (!access.hunt) throw forbidden('Only the assigned hunter or a coordinator can add bearings to this case, while it is being hunted.');
  const dryRun = req.nextUrl.searchParams.get('dryRun') === '1';
  const { rows, problems } = parseBearingsCsv(await readText(req));
  if (dryRun) return json({ dryRun: true, valid: rows.length, problems, rows: rows.map(previewRow) });
  if (problems.length) throw new AppError(400, `${problems.length} ${problems.length === 1 ? 'problem' : 'problems'} in the CSV: nothing was imported.`, { problems });
  const imported = await inTransaction(async (trx) => {
    const { row } = await lockVisibleCase(trx, me, id);
    const settings = await getClubSettings(trx);
    for (const r of rows) await addBearing(trx, me, row, settings, r.input);
    return rows.length;
  });
  return json({ imported }, 201);
});
