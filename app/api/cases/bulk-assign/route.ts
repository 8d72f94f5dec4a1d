import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { lockVisibleCase } from '@/lib/hunt/case-detail';
import { bulkAssignSchema } from '@/lib/validation/queue';
import { assignLockedCase } from '@/lib/hunt/assign';

/** Coordinators: assign (or unassign) up to 100 cases at once; all of them or none. */
export const POST = route(async (req) => {
  const me = await requireUser('admin', 'coordinator');
  const input = bulkAssignSchema.parse(await readJson(req));
  const changed = await inTransaction(async (trx) => {
    let n = 0;
    // Locks in id order, so two bulk assignments never wait on each other in a circle.
    for (const id of [...new Set(input.caseIds)].sort()) {
      const { row } = await lockVisibleCase(trx, me, id);
      if (await assignLockedCase(trx, me, row, input.assigneeId)) n++;
    }
    return n;
  });
  return json({ changed });
});
