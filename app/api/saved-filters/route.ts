import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listSavedFilters, saveFilter } from '@/db/queue';
import { parseQueueParams, savedFilterSchema } from '@/lib/validation/queue';

/** The caller's own saved queue views. */
export const GET = route(async () => {
  const me = await requireUser();
  return json({ items: await listSavedFilters(me.id) });
});

/** Saves (or replaces, by name) a view: the queue's query string, checked like the queue checks it. */
export const POST = route(async (req) => {
  const me = await requireUser();
  const input = savedFilterSchema.parse(await readJson(req));
  const params = new URLSearchParams(input.query);
  params.delete('cursor');
  params.delete('page');
  parseQueueParams(params);
  const saved = await inTransaction((trx) => saveFilter(trx, me.id, { name: input.name, query: params.toString() }));
  return json(saved, 201);
});
