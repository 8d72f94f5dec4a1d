import { route, json, readJson } from '@/lib/api/handler';
import { requireUser, requireUserAndCasesRevision } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listQueue } from '@/db/queue';
import { reportSchema } from '@/lib/validation/cases';
import { parseQueueParams } from '@/lib/validation/queue';
import { fileReport } from '@/lib/hunt/reports';
import { toCaseDetail } from '@/lib/hunt/case-detail';
import { cachedCaseList } from '@/lib/cache/case-lists';

/**
 * Cases the caller may see, server-sorted and filtered (lib/validation/queue.ts): keyset pages through
 * `cursor` (answer's nextCursor), `?page=N` for links and scripts, and a total counted up to 10,000.
 * Kept until a case changes (lib/cache/case-lists.ts).
 */
export const GET = route(async (req) => {
  const { me, casesRevision } = await requireUserAndCasesRevision();
  const params = parseQueueParams(req.nextUrl.searchParams);
  return json(await cachedCaseList(me, casesRevision, 'queue', params, () => listQueue(me, params)));
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
