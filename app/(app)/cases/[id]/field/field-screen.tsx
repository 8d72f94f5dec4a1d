'use client';

import { useState } from 'react';
import Link from 'next/link';
import { CaseMapClient } from '@/components/map/case-map-client';
import { NoticeBox } from '@/components/ui/notice-box';
import { BearingForm } from '@/components/hunt/bearing-form';
import { BearingList } from '@/components/hunt/bearing-list';
import { BottomSheet } from '@/components/hunt/bottom-sheet';
import { FixSummary } from '@/components/hunt/fix-summary';
import { formatLatLon } from '@/components/hunt/format-position';
import { SweepEntry } from '@/components/hunt/sweep-entry';
import { useHuntData } from '@/components/hunt/use-hunt-data';
import { DoorsSection } from '@/components/hunt/doors-section';
import { useDoors } from '@/components/hunt/use-doors';
import { formatApproxMetres } from '@/components/map/map-geometry';

type LatLon = { lat: number; lon: number };
type Sheet = 'bearing' | 'sweep' | null;

/**
 * One case in the field, for a phone held in one hand: the map on top, the fix in big type, the
 * lines taken so far, and the actions at the bottom of the screen. Refreshes on its own (another
 * hunter's lines appear) and when the phone wakes.
 */
export function FieldScreen({ caseId }: { caseId: string }) {
  const { caseDetail, bearings, fix, error, refresh } = useHuntData(caseId);
  const [sheet, setSheet] = useState<Sheet>(null);
  const [selected, setSelected] = useState<{ position: LatLon; why: string } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const doors = useDoors(caseId, fix, caseDetail?.can.hunt ?? false);

  if (error && !caseDetail) {
    return (
      <div className="space-y-3">
        <NoticeBox tone="error" title="This case could not be loaded">
          {error.message}
        </NoticeBox>
        <button type="button" className="btn-primary" onClick={() => void refresh()}>
          Try again
        </button>
        <p>
          <Link href="/cases">Back to the cases</Link>
        </p>
      </div>
    );
  }
  if (!caseDetail) {
    return (
      <p className="card text-ink-soft" aria-busy="true">
        Loading the case…
      </p>
    );
  }

  const f = fix?.current?.fix;
  const outlierIds = f && f.ok ? f.outlierIds : [];
  const canHunt = caseDetail.can.hunt;
  const formProps = {
    caseId,
    caseDetail,
    defaultFrequencyKhz: caseDetail.report.frequenciesKhz?.[0],
    selectedPosition: selected?.position ?? null,
    onSaved: () => {
      setSheet(null);
      setSelected(null);
      setSaved(sheet === 'sweep' ? 'Sweep saved; the fix is updated.' : 'Bearing saved; the fix is updated.');
      void refresh();
    },
  };

  return (
    <div className={`space-y-3 ${sheet ? 'pb-[72dvh]' : 'pb-28'}`}>
      <header className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-mono text-sm text-ink-soft">{caseDetail.reference}</p>
          <h1 className="text-xl leading-tight font-extrabold">{caseDetail.title}</h1>
        </div>
        <Link href={`/cases/${caseId}`} className="btn-quiet shrink-0 text-sm">
          Case page
        </Link>
      </header>

      <CaseMapClient
        className="h-[45dvh] min-h-64"
        bearings={bearings ?? []}
        fix={fix}
        reportedPosition={caseDetail.reportedPosition ?? null}
        selectedPosition={selected?.position ?? null}
        onMapTap={(p) => {
          setSaved(null);
          setSelected({ position: p, why: 'tapped on the map' });
        }}
        onSpotSelect={(s) => {
          setSaved(null);
          setSelected({ position: { lat: s.lat, lon: s.lon }, why: `suggested spot, ellipse ${formatApproxMetres(s.expectedSemiMajorM)} expected` });
        }}
        places={doors.highlight}
        focus={doors.focus}
      />

      <div aria-live="polite" className="space-y-2">
        {selected && (
          <div className="flex items-center gap-2 rounded-lg border border-flare-500 bg-flare-100 px-3 py-1 text-ink" data-testid="selected-position">
            <p className="min-w-0 flex-1 text-sm">
              Next bearing from <span className="font-semibold">{formatLatLon(selected.position.lat, selected.position.lon)}</span> ({selected.why})
            </p>
            <button type="button" className="btn-quiet shrink-0 text-sm" onClick={() => setSelected(null)}>
              Clear
            </button>
          </div>
        )}
        {saved && <NoticeBox tone="info">{saved}</NoticeBox>}
      </div>

      <div className="card">
        <FixSummary fix={fix} />
      </div>
      <DoorsSection doors={doors} canConfirm={canHunt} point={selected?.position ?? null} onConfirmed={() => void refresh()} />
      {!canHunt && <p className="text-ink-soft">You can follow this hunt but not add bearings to it.</p>}
      <BearingList caseId={caseId} bearings={bearings ?? []} outlierIds={outlierIds} canEdit={canHunt} refresh={refresh} />

      <p className="text-sm text-ink-soft">
        Public ground only · never touch or climb utility hardware · never confront anyone · local law and the regulator decide.{' '}
        <Link href="/cautions">All cautions</Link>
      </p>

      {canHunt && (
        // Stays under an open sheet so the focus can return to the button that opened it.
        <div className="fixed inset-x-0 bottom-0 z-[1050] border-t border-ink/15 bg-white/95 px-3 pt-2 pb-[max(0.75rem,env(safe-area-inset-bottom))] backdrop-blur">
          <div className="mx-auto flex max-w-2xl gap-2">
            <button type="button" className="btn-primary min-h-14 flex-[2] text-lg" onClick={() => setSheet('bearing')}>
              Add bearing
            </button>
            <button type="button" className="btn-quiet min-h-14 flex-1 text-lg" onClick={() => setSheet('sweep')}>
              Sweep
            </button>
          </div>
        </div>
      )}
      {sheet === 'bearing' && (
        <BottomSheet title="Add a bearing" onClose={() => setSheet(null)}>
          <BearingForm {...formProps} />
        </BottomSheet>
      )}
      {sheet === 'sweep' && (
        <BottomSheet title="Rotation sweep" onClose={() => setSheet(null)}>
          <SweepEntry {...formProps} />
        </BottomSheet>
      )}
    </div>
  );
}
