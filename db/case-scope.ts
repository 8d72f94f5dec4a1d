import type { Knex } from 'knex';
import type { Role } from './types';
import { CASE_RULES, RELATIONS, type CaseRight, type Relation } from '@/lib/hunt/access';

const COLUMN = { assigneeId: 'assignee_id', reporterId: 'reporter_id' } as const;

/**
 * The query form of lib/hunt/access.ts: limits a query on `cases as <alias>` to the cases on
 * which `me` has `right`, built from the same table of rules as `caseAccess`. A relation the
 * user's role cannot hold adds nothing; no relation at all matches no row.
 */
export function whereCaseRight(b: Knex.QueryBuilder, me: { id: string; role: Role }, right: CaseRight, alias = 'c'): Knex.QueryBuilder {
  const terms = Object.entries(CASE_RULES[right])
    .map(([relation, statuses]) => ({ relation: RELATIONS[relation as Relation], statuses }))
    .filter(({ relation }) => relation.roles.includes(me.role));
  return b.where((w) => {
    if (terms.length === 0) w.whereRaw('false');
    for (const { relation, statuses } of terms) {
      w.orWhere((t) => {
        if (relation.column) t.where(`${alias}.${COLUMN[relation.column]}`, me.id);
        else t.whereRaw('true');
        if (statuses !== 'any') t.whereIn(`${alias}.status`, [...statuses]);
      });
    }
  });
}

/** Coordinators and admins: the committee relation of lib/hunt/access.ts. */
export const isCommittee = (role: Role) => RELATIONS.committee.roles.includes(role);
