import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { listActiveHunters } from '@/db/users';

/** People a coordinator can assign a case to. */
export const GET = route(async () => {
  await requireUser('admin', 'coordinator');
  const items = await listActiveHunters();
  return json({ items, total: items.length, page: 1, pageSize: items.length });
});
