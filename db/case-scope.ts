import type { Knex } from 'knex';
import type { Role } from './types';

/**
 * The list form of the case access rule (lib/hunt/access.ts caseAccess.view): coordinators and admins
 * see every case, anyone else the cases assigned to them or reported by them. `alias` is the cases
 * table's alias in the query.
 */
export function scopeVisibleCases<B extends Knex.QueryBuilder>(b: B, viewer: { id: string; role: Role }, alias = 'c'): B {
  if (viewer.role === 'admin' || viewer.role === 'coordinator') return b;
  return b.where((w) => {
    if (viewer.role === 'hunter') w.where(`${alias}.assignee_id`, viewer.id).orWhere(`${alias}.reporter_id`, viewer.id);
    else w.where(`${alias}.reporter_id`, viewer.id);
  }) as B;
}

export const isCommittee = (role: Role) => role === 'admin' || role === 'coordinator';
