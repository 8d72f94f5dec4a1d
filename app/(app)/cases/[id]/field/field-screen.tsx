'use client';

import { useRef, useState } from 'react';
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
import { FieldQueueProvider } from '@/components/field/field-queue-context';
import { NextSpotsList } from '@/components/field/next-spots-list';
import { OfflineCopyNotice } from '@/components/field/offline-copy-notice';
import { OfflineFixCard } from '@/components/field/offline-fix-card';
import { PrepareArea } from '@/components/field/prepare-area';
import { QueuePanel } from '@/components/field/queue-panel';
import { TrailPeakCard } from '@/components/field/trail-peak-card';
import { useFieldQueue } from '@/components/field/use-field-queue';
import { useLevelTrails } from '@/components/field/use-level-trail';
import { useWatchedPosition } from '@/components/ui/use-geolocation';
import { WalkPanel } from '@/components/field/walk-panel';
import { FixFigure } from '@/components/field/fix-figure';

type LatLon = { lat: number; lon: number };
type Sheet = 'bearing' | 'sweep' | null;
type Mode = 'bearings' | 'walk';

/**
 * One case in the field, for a phone held in one hand: the map on top, the fix in big type (also
 * in the action bar, so it is never hidden under it), the lines taken so far, and the actions at
 * the bottom of the screen. Two modes: bearings, and the walk (level readings to the peak).
 * Works without a connection: the service worker keeps the last copy (and says when it was
 * loaded), and what is typed waits in the phone's queue until it can be sent. Refreshes on its
 * own (another hunter's lines appear) and when the phone wakes.
 */
export function FieldScreen({ caseId }: { caseId: string }) {
  const { caseDetail, bearings, fix, error, refresh } = useHuntData(caseId);
  const [sheet, setSheet] = useState<Sheet>(null);
  const [mode, setMode] = useState<Mode>('bearings');
  const [selected, setSelected] = useState<{ position: LatLon; why: string } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const doors = useDoors(caseId, fix, caseDetail?.can.hunt ?? false);
  const seeHunt = caseDetail?.can.hunt ?? false;
  const queue = useFieldQueue(caseId, () => {
    void refresh();
    void trailQ.refresh();
  });
  const trailQ = useLevelTrails(caseId, queue.items, caseDetail !== undefined);
  const walkPoints = trailQ.walk?.points.length ?? 0;
  // Paused while a form is open: the form reads the position itself (one request at a time to the phone's GPS).
  const phone = useWatchedPosition(seeHunt && sheet === null);
  const lastQueued = useRef(false);
  const hold = async (url: string, body: Record<string, unknown> & { clientId: string }) => {
    lastQueued.current = true;
    await queue.hold(url, body);
  };

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
      const what = sheet === 'sweep' ? 'Sweep' : 'Bearing';
      setSheet(null);
      setSelected(null);
      setSaved(lastQueued.current ? `${what} kept on this phone: it is sent when the connection returns.` : `${what} saved; the fix is updated.`);
      lastQueued.current = false;
      void refresh();
    },
  };

  return (
    <FieldQueueProvider value={hold}>
    <div className={`space-y-3 ${sheet ? 'pb-[72dvh]' : 'pb-32'}`}>
      <header className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-mono text-sm text-ink-soft">{caseDetail.reference}</p>
          <h1 className="text-xl leading-tight font-extrabold">{caseDetail.title}</h1>
        </div>
        <Link href={`/cases/${caseId}`} className="btn-quiet min-h-12 shrink-0 text-sm">
          Case page
        </Link>
      </header>

      <OfflineCopyNotice prefix={`/api/cases/${caseId}`} />

      {canHunt && (
        <div role="group" aria-label="Field mode" className="grid grid-cols-2 gap-2">
          {(['bearings', 'walk'] as const).map((m) => (
            <button key={m} type="button" aria-pressed={mode === m} className={`${mode === m ? 'btn-primary' : 'btn-quiet'} min-h-12`} onClick={() => setMode(m)}>
              {m === 'bearings' ? 'Bearings' : 'Walk'}
            </button>
          ))}
        </div>
      )}

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
        levelTrails={trailQ.trails}
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

      <QueuePanel queue={queue} />
      {mode === 'walk' && canHunt && (
        <>
          <WalkPanel
            caseId={caseId}
            queue={queue}
            position={phone.position}
            positionError={phone.error}
            tapped={selected?.position ?? null}
            defaultFrequencyKhz={caseDetail.report.frequenciesKhz?.[0]}
            onSaved={() => void trailQ.refresh()}
          />
          <TrailPeakCard
            trail={trailQ.walk}
            onUse={(p) => {
              setSaved(null);
              setSelected({ position: p, why: 'the walk’s level peak' });
            }}
          />
        </>
      )}
      <div className="card">
        <FixSummary fix={fix} />
      </div>
      <OfflineFixCard bearings={bearings ?? []} queued={queue.items} />
      {mode === 'bearings' && (
        <NextSpotsList
          bearings={bearings ?? []}
          serverSpots={fix?.nextSpots ?? []}
          from={phone.position}
          onPick={(s) => {
            setSaved(null);
            setSelected({ position: { lat: s.lat, lon: s.lon }, why: `suggested spot, ellipse ${formatApproxMetres(s.expectedSemiMajorM)} expected` });
          }}
        />
      )}
      <DoorsSection doors={doors} canConfirm={canHunt} point={selected?.position ?? null} onConfirmed={() => void refresh()} />
      {!canHunt && <p className="text-ink-soft">You can follow this hunt but not add bearings to it.</p>}
      <BearingList caseId={caseId} bearings={bearings ?? []} outlierIds={outlierIds} canEdit={canHunt} refresh={refresh} />

      {canHunt && <PrepareArea caseId={caseId} fixId={fix?.current?.id} centre={f && f.ok ? { lat: f.lat, lon: f.lon } : (caseDetail.reportedPosition ?? null)} />}

      <p className="text-sm text-ink-soft">
        Public ground only · never touch or climb utility hardware · never confront anyone · local law and the regulator decide.{' '}
        <Link href="/cautions">All cautions</Link>
      </p>

      {canHunt && (
        // Stays under an open sheet so the focus can return to the button that opened it.
        <div data-testid="action-bar" className="fixed inset-x-0 bottom-0 z-[1050] border-t border-ink/15 bg-white/95 px-3 pt-2 pb-[max(0.75rem,env(safe-area-inset-bottom))] backdrop-blur">
          <div className="mx-auto flex max-w-2xl items-center gap-2">
            <FixFigure fix={fix} waiting={queue.waiting.length} />
            {mode === 'bearings' ? (
              <>
                {/* A 360-px phone: "±151 m" beside "Add bearing" and "Sweep", each label on one line. */}
                <button type="button" className="btn-primary min-h-14 flex-1 px-3 text-base sm:text-lg" onClick={() => setSheet('bearing')}>
                  Add bearing
                </button>
                <button type="button" className="btn-quiet min-h-14 flex-none px-3 text-base sm:text-lg" onClick={() => setSheet('sweep')}>
                  Sweep
                </button>
              </>
            ) : (
              <p className="flex-[3] text-base font-semibold" data-testid="walk-bar">
                {walkPoints} {walkPoints === 1 ? 'reading' : 'readings'} on the walk
              </p>
            )}
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
    </FieldQueueProvider>
  );
}
