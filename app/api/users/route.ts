import { route, json } from '@/lib/api/handler';
import { parsePaging } from '@/lib/api/paging';
import { requireUser } from '@/lib/auth/session';
import { listUsers } from '@/db/users';

export const GET = route(async (req) => {
  await requireUser('admin');
  return json(await listUsers(parsePaging(req.nextUrl.searchParams)));
});
