import { z } from 'zod';
import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { countActiveAdmins, getUserById, lockAdminChanges, lockUserForChange, updateUser } from '@/db/users';
import { userPatchSchema } from '@/lib/validation/users';
import { conflict, notFound } from '@/lib/errors';

const paramsSchema = z.object({ id: z.uuid() });

/** Admin: change a user's role or deactivate / reactivate them. The last active admin stays. */
export const PATCH = route<{ id: string }>(async (req, ctx) => {
  const { id } = paramsSchema.parse(await ctx.params);
  await requireUser('admin');
  const patch = userPatchSchema.parse(await readJson(req));
  const updated = await inTransaction(async (trx) => {
    const target = await lockUserForChange(trx, id);
    if (!target) throw notFound('No such user.');
    const losesAdmin = target.role === 'admin' && target.active && (patch.role && patch.role !== 'admin' || patch.active === false);
    if (losesAdmin) {
      await lockAdminChanges(trx);
      if ((await countActiveAdmins(trx)) <= 1) throw conflict('This is the last active admin; make someone else admin first.');
    }
    return updateUser(trx, id, patch);
  });
  return json(updated ?? (await getUserById(id)));
});
