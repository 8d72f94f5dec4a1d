import { z } from 'zod';
import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { deleteSavedFilter } from '@/db/queue';
import { notFound } from '@/lib/errors';

/** Removes one of the caller's saved views (someone else's is a plain 404). */
export const DELETE = route<{ id: string }>(async (_req, ctx) => {
  const { id } = z.object({ id: z.uuid() }).parse(await ctx.params);
  const me = await requireUser();
  if (!(await inTransaction((trx) => deleteSavedFilter(trx, me.id, id)))) throw notFound('No such saved view.');
  return json({ deleted: true });
});
