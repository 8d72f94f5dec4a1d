import type { Knex } from 'knex';
import { appendEvent, latestPremisesConfirmation, writeCase } from '@/db/cases';
import { latestFixSnapshot } from '@/db/fixes';
import { getClubSettings } from '@/db/settings';
import type { CaseRow, CaseStatus, User } from '@/db/types';
import { AppError, forbidden } from '@/lib/errors';
import type { z } from 'zod';
import type { transitionSchema } from '@/lib/validation/cases';
import { allowedTransitions, caseAccess, mayAttemptTransition } from './access';
import { isLocatable } from './fix';
import { assertVersion } from './stale';

type Transition = z.output<typeof transitionSchema>;

/** 422: the request is well-formed but the case's evidence does not allow it yet. */
export const ruleNotMet = (message: string) => new AppError(422, message);

async function checkEvidence(trx: Knex.Transaction, user: User, row: CaseRow, t: Transition): Promise<Record<string, unknown>> {
  switch (t.to) {
    case 'located': {
      if (t.evidence === 'fix') {
        const { locateThresholdM } = await getClubSettings(trx);
        const fix = (await latestFixSnapshot(row.id, trx))?.result;
        if (!fix?.ok) throw ruleNotMet('There is no fix yet: take bearings from at least two well-separated spots first.');
        if (!isLocatable(fix, locateThresholdM)) {
          throw ruleNotMet(
            `The fix's 95 % error ellipse is ${Math.round(fix.ellipse.semiMajorM)} m long (semi-major), above the club's ${locateThresholdM} m. ` +
              'Take another bearing from one of the suggested spots.',
          );
        }
        return { evidence: 'fix', lat: fix.lat, lon: fix.lon, semiMajorM: fix.ellipse.semiMajorM };
      }
      if (!caseAccess(user, row).committee) throw forbidden('A coordinator must agree to locating a case by confirmed premises.');
      const confirmed = await latestPremisesConfirmation(trx, row.id);
      if (!confirmed) throw ruleNotMet('No hunter has confirmed the premises yet: a hunter records that in a comment first.');
      return { evidence: 'premises', confirmationEventId: confirmed.id };
    }
    case 'notified':
      if (new Date(t.deliveredOn) > new Date()) throw ruleNotMet('The delivery date is in the future.');
      return { method: t.method, deliveredOn: t.deliveredOn };
    case 'resolved':
      return { outcome: t.outcome, levelBeforeDbm: t.levelBeforeDbm ?? null, levelAfterDbm: t.levelAfterDbm ?? null };
    case 'open':
      return { reason: t.reason };
  }
}

/** Validates who, from which state and with what evidence; writes the case and its timeline entry. */
export async function applyTransition(trx: Knex.Transaction, user: User, row: CaseRow, t: Transition): Promise<void> {
  if (!mayAttemptTransition(user, row, t.to)) throw forbidden(`Your role cannot move a case to ${t.to}.`);
  await assertVersion(trx, row, t.version);
  if (!allowedTransitions(user, row).includes(t.to)) throw ruleNotMet(`A case that is ${row.status} cannot move to ${t.to}.`);
  const evidence = await checkEvidence(trx, user, row, t);
  await writeCase(trx, row.id, {
    status: t.to,
    ...(t.to === 'resolved'
      ? { outcome: t.outcome, levelBeforeDbm: t.levelBeforeDbm ?? null, levelAfterDbm: t.levelAfterDbm ?? null, resolvedAt: new Date() }
      : {}),
    ...(t.to === 'open' ? { outcome: null, resolvedAt: null } : {}),
  });
  await appendEvent(trx, {
    caseId: row.id,
    actorId: user.id,
    kind: 'status-changed',
    data: { from: row.status, to: t.to, ...evidence, note: 'note' in t ? t.note : undefined },
    visibility: 'all',
  });
}
