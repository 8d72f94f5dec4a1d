import type { CaseRow, CaseStatus, Role, User } from '@/db/types';

/**
 * Who may do what with a case: the one table of rules. Every list, page and handler asks it,
 * either through `caseAccess` (a loaded row, pure) or through the query scope `whereCaseRight`
 * in db/case-scope.ts, which db/ builds from the same table, so a case a list leaves out is
 * one its page refuses, and the other way round.
 */

/** How a user can stand to a case. */
export type Relation = 'committee' | 'assignedHunter' | 'reporter';

/**
 * Each relation as data: the roles it needs and, when it is personal, the case column that must
 * hold the user's id. (Data, not code, so that db/ can turn it into a WHERE clause.)
 */
export const RELATIONS: Record<Relation, { roles: readonly Role[]; column?: 'assigneeId' | 'reporterId' }> = {
  committee: { roles: ['admin', 'coordinator'] },
  assignedHunter: { roles: ['hunter'], column: 'assigneeId' },
  reporter: { roles: ['admin', 'coordinator', 'hunter', 'member'], column: 'reporterId' },
};

const ANY_STATUS = 'any' as const;
/** Statuses in which the assigned hunter is still hunting. */
export const HUNTABLE: readonly CaseStatus[] = ['open', 'located'];

export type CaseRight = 'view' | 'seeHunt' | 'hunt' | 'comment' | 'committee';

/** For each right: the relations that give it, and in which statuses of the case. */
export const CASE_RULES: Record<CaseRight, Partial<Record<Relation, readonly CaseStatus[] | typeof ANY_STATUS>>> = {
  /** open the case at all (anyone else gets a plain 404) */
  view: { committee: ANY_STATUS, assignedHunter: ANY_STATUS, reporter: ANY_STATUS },
  /** reporter's position and identity, bearings, fixes, notices' existence */
  seeHunt: { committee: ANY_STATUS, assignedHunter: ANY_STATUS },
  /** add or edit bearings and sweeps */
  hunt: { committee: ANY_STATUS, assignedHunter: HUNTABLE },
  comment: { committee: ANY_STATUS, assignedHunter: ANY_STATUS, reporter: ANY_STATUS },
  /** triage, assign, edit, merge, every transition, notices' contents */
  committee: { committee: ANY_STATUS },
};

export type CaseFacts = Pick<CaseRow, 'reporterId' | 'assigneeId' | 'status'>;

/** Whether `user` stands in `relation` to the case. */
export function holdsRelation(user: Pick<User, 'id' | 'role'>, c: CaseFacts, relation: Relation): boolean {
  const r = RELATIONS[relation];
  return r.roles.includes(user.role) && (!r.column || c[r.column] === user.id);
}

/** Whether the table gives `user` this right on the case. */
export function hasCaseRight(user: Pick<User, 'id' | 'role'>, c: CaseFacts, right: CaseRight): boolean {
  return Object.entries(CASE_RULES[right]).some(
    ([relation, statuses]) => holdsRelation(user, c, relation as Relation) && (statuses === ANY_STATUS || statuses.includes(c.status)),
  );
}

/** What one user may do with one case. */
export type CaseAccess = Record<CaseRight, boolean> & { isReporter: boolean };

export function caseAccess(user: Pick<User, 'id' | 'role'>, c: CaseFacts): CaseAccess {
  const rights = Object.keys(CASE_RULES) as CaseRight[];
  return { ...(Object.fromEntries(rights.map((r) => [r, hasCaseRight(user, c, r)])) as Record<CaseRight, boolean>), isReporter: holdsRelation(user, c, 'reporter') };
}

/**
 * The statuses a user could move the case to (the evidence is checked when they try): the
 * assigned hunter proposes "located" for an open case; the committee makes every move the
 * lifecycle allows (open -> located -> notified -> resolved, back to open, resolved from any).
 */
export const TRANSITION_RULES: { to: CaseStatus; from: readonly CaseStatus[]; by: readonly Relation[] }[] = [
  { to: 'located', from: ['open'], by: ['committee', 'assignedHunter'] },
  { to: 'notified', from: ['located'], by: ['committee'] },
  { to: 'resolved', from: ['open', 'located', 'notified'], by: ['committee'] },
  { to: 'open', from: ['located', 'notified', 'resolved'], by: ['committee'] },
];

/** Whether the user's relation to the case lets them try a move to `to` at all (from any status). */
export function mayAttemptTransition(user: Pick<User, 'id' | 'role'>, c: CaseFacts, to: CaseStatus): boolean {
  return TRANSITION_RULES.some((t) => t.to === to && t.by.some((r) => holdsRelation(user, c, r)));
}

export function allowedTransitions(user: Pick<User, 'id' | 'role'>, c: CaseFacts): CaseStatus[] {
  return TRANSITION_RULES.filter((t) => t.from.includes(c.status) && t.by.some((r) => holdsRelation(user, c, r))).map((t) => t.to);
}
