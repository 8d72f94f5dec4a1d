import type { Knex } from 'knex';
import { appendEvent, writeCase } from '@/db/cases';
import { getUserById } from '@/db/users';
import type { CaseRow, User } from '@/db/types';
import { badRequest } from '@/lib/errors';

/**
 * Assigns (or unassigns, with null) a case the caller has locked in `trx`, with its timeline entry.
 * Only active hunters, coordinators and admins take cases. Returns false when nothing changed.
 */
export async function assignLockedCase(trx: Knex.Transaction, me: Pick<User, 'id'>, current: Pick<CaseRow, 'id' | 'assigneeId'>, assigneeId: string | null): Promise<boolean> {
  if (assigneeId === current.assigneeId) return false;
  const hunter = assigneeId ? await getUserById(assigneeId, trx) : undefined;
  if (assigneeId && (!hunter?.active || hunter.role === 'member')) throw badRequest('Assign the case to an active hunter, coordinator or admin.');
  await writeCase(trx, current.id, { assigneeId });
  await appendEvent(trx, {
    caseId: current.id,
    actorId: me.id,
    kind: assigneeId ? 'assigned' : 'unassigned',
    data: { assigneeId, assigneeName: hunter?.name ?? null, previousAssigneeId: current.assigneeId },
  });
  return true;
}
