import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { db } from '@/db';
import { casePeople, listEvents } from '@/db/cases';
import { listBearings } from '@/db/bearings';
import { latestFixSnapshot } from '@/db/fixes';
import { getPremises } from '@/db/premises';
import { getClubSettings } from '@/db/settings';
import { dossierNotices } from '@/db/dossier';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { renderDossier } from '@/lib/dossier/render';
import type { ReportData } from '@/lib/hunt/views';

/** The case dossier (PDF) for a referral to the utility or the regulator: committee only. */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser('admin', 'coordinator');
  const { row } = await loadVisibleCase(me, id);
  const [settings, bearings, snapshot, premises, events, { notices, answers }, people] = await Promise.all([
    getClubSettings(),
    listBearings(id),
    latestFixSnapshot(id),
    getPremises(id),
    listEvents(id, { includeCommittee: true }),
    dossierNotices(id),
    row.consentShareName && row.reporterId ? casePeople(db, [row.reporterId]) : Promise.resolve([]),
  ]);
  const report = row.report as ReportData;
  const pdf = await renderDossier({
    clubName: settings.clubName,
    contactEmail: settings.contactEmail,
    noiseEnvironment: settings.noiseEnvironment,
    c: { ...row, reportLevelDbm: report.levelDbm ?? null, frequencyKhz: report.frequenciesKhz?.[0] ?? bearings.find((b) => b.frequencyKhz)?.frequencyKhz ?? null },
    reporterName: people[0]?.name ?? null,
    reporterId: row.reporterId,
    premises: premises ? { address: premises.address, how: premises.how } : null,
    bearings,
    fix: snapshot?.result,
    events,
    notices,
    answers,
  });
  return new NextResponse(Buffer.from(pdf), {
    headers: { 'content-type': 'application/pdf', 'content-disposition': `inline; filename="${row.reference}-dossier.pdf"`, 'cache-control': 'no-store' },
  });
});
