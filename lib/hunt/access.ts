import type { CaseRow, CaseStatus, User } from '@/db/types';

/** What one user may do with one case. The single place these rules live. */
export type CaseAccess = {
  view: boolean;
  /** coordinators and admins */
  committee: boolean;
  /** reporter's position and identity, bearings, fixes: committee and the assigned hunter */
  seeHunt: boolean;
  /** add or edit bearings and sweeps: committee, or the assigned hunter while the case is being hunted */
  hunt: boolean;
  comment: boolean;
  isReporter: boolean;
};

const HUNTABLE: CaseStatus[] = ['open', 'located'];

export function caseAccess(user: Pick<User, 'id' | 'role'>, c: Pick<CaseRow, 'reporterId' | 'assigneeId' | 'status'>): CaseAccess {
  const committee = user.role === 'admin' || user.role === 'coordinator';
  const assignedHunter = user.role === 'hunter' && c.assigneeId === user.id;
  const isReporter = c.reporterId === user.id;
  const view = committee || assignedHunter || isReporter;
  return {
    view,
    committee,
    seeHunt: committee || assignedHunter,
    hunt: committee || (assignedHunter && HUNTABLE.includes(c.status)),
    comment: view,
    isReporter,
  };
}

/** The statuses a user could move the case to (the evidence is checked when they try). */
export function allowedTransitions(user: Pick<User, 'id' | 'role'>, c: Pick<CaseRow, 'reporterId' | 'assigneeId' | 'status'>): CaseStatus[] {
  const a = caseAccess(user, c);
  const out: CaseStatus[] = [];
  if (c.status === 'open' && (a.committee || (a.seeHunt && user.role === 'hunter'))) out.push('located');
  if (!a.committee) return out;
  if (c.status === 'located') out.push('notified');
  if (c.status !== 'resolved') out.push('resolved');
  if (c.status !== 'open') out.push('open');
  return out;
}

/**
 * Evidence files follow the case: whoever may see the case sees its files and may add to them;
 * a file is deleted by whoever attached it or by the committee. Photos as uploaded (with their
 * location and camera data) are for the committee; everyone else gets the stripped copy.
 */
export function fileAccess(user: Pick<User, 'id' | 'role'>, access: CaseAccess, file?: { uploadedBy: string | null }) {
  return {
    see: access.view,
    add: access.comment,
    delete: access.committee || (!!file && file.uploadedBy === user.id),
    originalPhoto: access.committee,
  };
}
