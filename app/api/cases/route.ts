import { route, json, readJson } from '@/lib/api/handler';
import { parsePaging } from '@/lib/api/paging';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listCasesFor } from '@/db/cases';
import { caseFilterSchema, reportSchema } from '@/lib/validation/cases';
import { fileReport } from '@/lib/hunt/reports';
import { toCaseDetail } from '@/lib/hunt/case-detail';

/** Cases the caller may see (see listCasesFor), newest activity first. */
export const GET = route(async (req) => {
  const me = await requireUser();
  const sp = req.nextUrl.searchParams;
  const filter = caseFilterSchema.parse(Object.fromEntries([...sp].filter(([k]) => k in caseFilterSchema.shape)));
  return json(await listCasesFor(me, filter, parsePaging(sp)));
});

/** Any signed-in person files a noise report; it becomes an open case. */
export const POST = route(async (req) => {
  const me = await requireUser();
  const input = reportSchema.parse(await readJson(req));
  const { row, duplicateOf } = await inTransaction((trx) => fileReport(trx, me, input));
  const detail = await toCaseDetail(me, row);
  const committee = me.role === 'admin' || me.role === 'coordinator';
  return json({ case: detail, possibleDuplicate: committee ? (duplicateOf ?? null) : null }, 201);
});
