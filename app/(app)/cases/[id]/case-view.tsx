'use client';

import Link from 'next/link';
import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import type { CaseDetail } from '@/lib/hunt/views';
import { useCaseEvents, useHuntData } from '@/components/hunt/use-hunt-data';
import { NoticeBox } from '@/components/ui/notice-box';
import { EvidenceCard } from '@/components/evidence/evidence-card';
import { LevelLogCard } from '@/components/levels/level-log-card';
import { SurveyImportCard } from '@/components/levels/survey-import-card';
import { AssignmentCard } from './_components/assignment-card';
import { CaseDetails } from './_components/case-details';
import { CaseHeader } from './_components/case-header';
import { CaseTimeline } from './_components/case-timeline';
import { CommentBox } from './_components/comment-box';
import { DuplicateBanner } from './_components/duplicate-banner';
import { HuntPanel } from './_components/hunt-panel';
import { StatusActions } from './_components/status-actions';

/** One case: what was reported, who hunts it, where it stands, its history and (for the committee) the hunt. */
export function CaseView({ caseId, justFiled }: { caseId: string; justFiled: boolean }) {
  // Same key as useHuntData's case query (SWR shares it): tells us whether to load the hunt at all.
  const seeHunt = useSWR<CaseDetail>(`/api/cases/${caseId}`, fetchJson).data?.can.seeHunt ?? false;
  const { caseDetail: c, bearings, fix, error, refresh } = useHuntData(caseId, { seeHunt });
  const events = useCaseEvents(caseId);
  const refreshAll = () => Promise.all([refresh(), events.mutate()]);

  if (!c) {
    if (error)
      return (
        <div className="max-w-lg space-y-3">
          <NoticeBox tone="error" title="This case could not be opened">
            {error.message}
          </NoticeBox>
          <Link href="/cases" className="btn-quiet">
            Back to the cases
          </Link>
        </div>
      );
    return (
      <div className="space-y-3" aria-busy="true">
        <p role="status">Loading the case…</p>
        <div className="card h-20 animate-pulse bg-paper-deep" />
      </div>
    );
  }

  return (
    <div className="space-y-4" data-testid="case-view">
      <CaseHeader c={c} />
      {justFiled && (
        <NoticeBox title="Report filed">
          Thank you. The committee will look at it and may assign a hunter; you can follow it here and add comments.
        </NoticeBox>
      )}
      <DuplicateBanner c={c} refresh={refreshAll} />
      <div className={`grid gap-4 ${c.can.seeHunt ? 'lg:grid-cols-2' : ''}`}>
        <div className="min-w-0 space-y-4">
          <StatusActions c={c} fix={fix} refresh={refreshAll} />
          {c.can.seeHunt && c.status !== 'open' && (
            <p>
              <Link href={`/cases/${c.id}/notices`} className="btn-quiet w-full sm:w-auto" data-testid="notices-link">
                Notices and letters
              </Link>
            </p>
          )}
          <CaseDetails c={c} />
          <AssignmentCard c={c} refresh={refreshAll} />
          <EvidenceCard caseId={c.id} canAdd={c.can.comment} />
          <CaseTimeline events={events.data} error={events.error}>
            {c.can.comment && <CommentBox caseId={c.id} canConfirm={c.can.confirmPremises} onPosted={() => events.mutate()} />}
          </CaseTimeline>
        </div>
        {c.can.seeHunt && (
          <div className="min-w-0">
            <HuntPanel c={c} bearings={bearings} fix={fix} error={error} refresh={refreshAll} />
            {c.can.hunt && (
              <div className="mt-4">
                <SurveyImportCard caseId={c.id} defaultFrequencyKhz={c.report.frequenciesKhz?.[0]} />
              </div>
            )}
            <div className="mt-4">
              <LevelLogCard caseId={c.id} />
            </div>
          </div>
        )}
      </div>
      <p className="text-sm text-ink-faint">
        Hunt from public ground only, never touch utility hardware, never confront anyone. Read the <Link href="/cautions">cautions</Link>.
      </p>
    </div>
  );
}
