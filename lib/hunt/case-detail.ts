import type { Knex } from 'knex';
import { z } from 'zod';
import { db } from '@/db';
import { caseRefs, casePeople, getCaseWithRight, lockCaseWithRight } from '@/db/cases';
import { getClubSettings } from '@/db/settings';
import type { CaseRow, User } from '@/db/types';
import { notFound } from '@/lib/errors';
import { allowedTransitions, caseAccess, type CaseAccess } from './access';
import type { CaseDetail, ReportData } from './views';

export const caseIdSchema = z.object({ id: z.uuid('Not a case id.') });

type Visible = { row: CaseRow; access: CaseAccess };
const noSuchCase = () => notFound('No such case.');

/**
 * The case if the user may see it (the access rule as a query), with what they may do on it.
 * A case the user may not see is a plain 404, the same as a missing one, so its existence is not
 * revealed. For reads; a write uses lockVisibleCase inside its transaction.
 */
export async function loadVisibleCase(user: User, id: string, q: Knex = db): Promise<Visible> {
  const row = await getCaseWithRight(q, user, id, 'view');
  if (!row) throw noSuchCase();
  return { row, access: caseAccess(user, row) };
}

/**
 * The case locked for the rest of the transaction, if the user may see it (else 404): look up and
 * authorise the row inside the transaction that writes it, not before it.
 */
export async function lockVisibleCase(trx: Knex.Transaction, user: User, id: string): Promise<Visible> {
  const row = await lockCaseWithRight(trx, user, id, 'view');
  if (!row) throw noSuchCase();
  return { row, access: caseAccess(user, row) };
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

/** The case as this user may see it: reporter identity and position only for those allowed. */
export async function toCaseDetail(user: User, row: CaseRow, q: Knex = db): Promise<CaseDetail> {
  const access = caseAccess(user, row);
  const [settings, people, refs] = await Promise.all([getClubSettings(q), casePeople(q, [row.assigneeId, row.reporterId]), caseRefs(q, [row.mergedInto, row.possibleDuplicateOf])]);
  const person = (id: string | null) => people.find((x) => x.id === id) ?? null;
  const ref = (id: string | null) => refs.find((r) => r.id === id) ?? null;

  const assignee = person(row.assigneeId);
  const merged = ref(row.mergedInto);
  const detail: CaseDetail = {
    id: row.id,
    reference: row.reference,
    title: row.title,
    description: row.description,
    status: row.status,
    bands: row.bands,
    version: row.version,
    createdAt: iso(row.createdAt)!,
    updatedAt: iso(row.updatedAt)!,
    report: row.report as ReportData,
    consentShareName: row.consentShareName,
    outcome: row.outcome,
    levelBeforeDbm: row.levelBeforeDbm,
    levelAfterDbm: row.levelAfterDbm,
    resolvedAt: iso(row.resolvedAt),
    mergedInto: merged ? { id: merged.id, reference: merged.reference } : null,
    assignee: assignee && { id: assignee.id, name: assignee.name, callSign: assignee.callSign },
    locateThresholdM: settings.locateThresholdM,
    maxPositionAccuracyM: settings.maxPositionAccuracyM,
    can: {
      edit: access.committee,
      assign: access.committee,
      comment: access.comment,
      hunt: access.hunt,
      seeHunt: access.seeHunt,
      merge: access.committee && !!row.possibleDuplicateOf && !row.mergedInto,
      confirmPremises: access.seeHunt,
      transitions: allowedTransitions(user, row),
    },
    viewerRole: user.role,
  };
  if (access.seeHunt || access.isReporter) {
    detail.reporter = person(row.reporterId);
    detail.reportedPosition = row.reportedLat !== null && row.reportedLon !== null ? { lat: row.reportedLat, lon: row.reportedLon } : null;
  }
  if (access.committee) detail.possibleDuplicate = row.mergedInto ? null : ref(row.possibleDuplicateOf);
  return detail;
}
