import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { listTemplates } from '@/db/templates';
import { PLACEHOLDERS } from '@/lib/notices/templates';

/** The notice templates (admin), with the placeholders they may use. */
export const GET = route(async () => {
  await requireUser('admin');
  const items = await listTemplates();
  return json({ items, total: items.length, page: 1, pageSize: items.length, placeholders: PLACEHOLDERS });
});
