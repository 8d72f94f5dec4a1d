import type { Knex } from 'knex';
import { z } from 'zod';
import { db } from '@/db';
import { getCase } from '@/db/cases';
import { getClubSettings } from '@/db/settings';
import type { CaseRow, User } from '@/db/types';
import { notFound } from '@/lib/errors';
import { allowedTransitions, caseAccess, type CaseAccess } from './access';
import type { CaseDetail, ReportData } from './views';

export const caseIdSchema = z.object({ id: z.uuid('Not a case id.') });

/**
 * The case if the user may see it. A case the user may not see is a plain 404, the same as a
 * missing one, so its existence is not revealed.
 */
export async function loadVisibleCase(user: User, id: string, q: Knex = db): Promise<{ row: CaseRow; access: CaseAccess }> {
  const row = await getCase(id, q);
  if (!row) throw notFound('No such case.');
  const access = caseAccess(user, row);
  if (!access.view) throw notFound('No such case.');
  return { row, access };
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

/** The case as this user may see it: reporter identity and position only for those allowed. */
export async function toCaseDetail(user: User, row: CaseRow, q: Knex = db): Promise<CaseDetail> {
  const access = caseAccess(user, row);
  const settings = await getClubSettings();
  const people = await q('users')
    .select('id', 'name', 'call_sign', 'email')
    .whereIn('id', [row.assigneeId, row.reporterId].filter((x): x is string => !!x));
  const person = (id: string | null) => {
    const p = people.find((x) => x.id === id);
    return p ? { id: p.id as string, name: p.name as string, callSign: (p.call_sign as string | null) ?? null, email: p.email as string } : null;
  };
  const refs = await q('cases')
    .select('id', 'reference', 'title')
    .whereIn('id', [row.mergedInto, row.possibleDuplicateOf].filter((x): x is string => !!x));
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
