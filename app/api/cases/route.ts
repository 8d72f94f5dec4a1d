import { z } from 'zod';
import { route, json } from '@/lib/api/handler';
import { parsePaging } from '@/lib/api/paging';
import { requireUser } from '@/lib/auth/session';
import { listCasesFor } from '@/db/cases';
import { CASE_STATUSES } from '@/db/types';

const filterSchema = z.object({
  status: z.enum(CASE_STATUSES).optional(),
  assigneeId: z.uuid().optional(),
  band: z.string().max(20).optional(),
  q: z.string().max(100).optional(),
});

/** Cases the caller may see (see listCasesFor), newest activity first. */
export const GET = route(async (req) => {
  const me = await requireUser();
  const sp = req.nextUrl.searchParams;
  const filter = filterSchema.parse(Object.fromEntries([...sp].filter(([k]) => k in filterSchema.shape)));
  return json(await listCasesFor(me, filter, parsePaging(sp)));
});
