/**
 * The case access rule and the allowed transitions, table-driven: every role against every way
 * of standing to a case, in every status. The expectations are the product's own rules
 * (shared/PRODUCT.md "People and roles" and "Case lifecycle"), written out by hand here rather than
 * derived from lib/hunt/access.ts's table, so a change to the table shows up as a failing row.
 */
import { describe, expect, it } from 'vitest';
import { allowedTransitions, caseAccess, mayAttemptTransition } from '@/lib/hunt/access';
import { CASE_STATUSES, type CaseStatus, type Role } from '@/db/types';

const ME = 'me';
type Stand = 'assigned' | 'reporter' | 'both' | 'stranger';
const caseFor = (stand: Stand, status: CaseStatus) => ({
  status,
  assigneeId: stand === 'assigned' || stand === 'both' ? ME : 'someone-else',
  reporterId: stand === 'reporter' || stand === 'both' ? ME : 'another-member',
});

type Row = { role: Role; stand: Stand; view: boolean; seeHunt: boolean; huntWhileOpen: boolean; committee: boolean };
const ROWS: Row[] = [
  { role: 'admin', stand: 'stranger', view: true, seeHunt: true, huntWhileOpen: true, committee: true },
  { role: 'coordinator', stand: 'stranger', view: true, seeHunt: true, huntWhileOpen: true, committee: true },
  { role: 'coordinator', stand: 'assigned', view: true, seeHunt: true, huntWhileOpen: true, committee: true },
  { role: 'hunter', stand: 'assigned', view: true, seeHunt: true, huntWhileOpen: true, committee: false },
  // A hunter who filed the report sees it (and it is in their list: the same rule), but not the hunt.
  { role: 'hunter', stand: 'reporter', view: true, seeHunt: false, huntWhileOpen: false, committee: false },
  { role: 'hunter', stand: 'both', view: true, seeHunt: true, huntWhileOpen: true, committee: false },
  { role: 'hunter', stand: 'stranger', view: false, seeHunt: false, huntWhileOpen: false, committee: false },
  { role: 'member', stand: 'reporter', view: true, seeHunt: false, huntWhileOpen: false, committee: false },
  // A member cannot hold an assignment: the column alone gives nothing.
  { role: 'member', stand: 'assigned', view: false, seeHunt: false, huntWhileOpen: false, committee: false },
  { role: 'member', stand: 'stranger', view: false, seeHunt: false, huntWhileOpen: false, committee: false },
];

describe('caseAccess', () => {
  it.each(ROWS.flatMap((r) => CASE_STATUSES.map((status) => ({ ...r, status }))))('$role ($stand) on a $status case', (r) => {
    const a = caseAccess({ id: ME, role: r.role }, caseFor(r.stand, r.status));
    expect(a.view).toBe(r.view);
    expect(a.comment).toBe(r.view);
    expect(a.seeHunt).toBe(r.seeHunt);
    expect(a.committee).toBe(r.committee);
    expect(a.isReporter).toBe(r.stand === 'reporter' || r.stand === 'both');
    // The assigned hunter hunts only while the case is open or located; the committee always.
    const huntable = r.status === 'open' || r.status === 'located';
    expect(a.hunt).toBe(r.committee || (r.huntWhileOpen && huntable));
  });
});

/** [role, stand, status, the statuses they may move it to] */
const MOVES: [Role, Stand, CaseStatus, CaseStatus[]][] = [
  ['coordinator', 'stranger', 'open', ['located', 'resolved']],
  ['coordinator', 'stranger', 'located', ['notified', 'resolved', 'open']],
  ['coordinator', 'stranger', 'notified', ['resolved', 'open']],
  ['coordinator', 'stranger', 'resolved', ['open']],
  ['admin', 'stranger', 'located', ['notified', 'resolved', 'open']],
  ['hunter', 'assigned', 'open', ['located']],
  ['hunter', 'assigned', 'located', []],
  ['hunter', 'assigned', 'notified', []],
  ['hunter', 'reporter', 'open', []],
  ['hunter', 'stranger', 'open', []],
  ['member', 'reporter', 'open', []],
  ['member', 'reporter', 'located', []],
];

describe('allowedTransitions', () => {
  it.each(MOVES)('%s (%s) on a %s case may move it to %j', (role, stand, status, to) => {
    const me = { id: ME, role };
    const c = caseFor(stand, status);
    expect(allowedTransitions(me, c)).toEqual(to);
    // Whatever is allowed may be attempted; a hunter may attempt only "located", a member nothing.
    for (const t of to) expect(mayAttemptTransition(me, c, t)).toBe(true);
  });

  it('lets only the committee attempt anything but located', () => {
    for (const role of ['hunter', 'member'] as const) {
      for (const to of ['notified', 'resolved', 'open'] as const) expect(mayAttemptTransition({ id: ME, role }, caseFor('both', 'located'), to)).toBe(false);
    }
    expect(mayAttemptTransition({ id: ME, role: 'member' }, caseFor('both', 'open'), 'located')).toBe(false);
  });
});
