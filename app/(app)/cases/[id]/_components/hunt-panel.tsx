'use client';

import Link from 'next/link';
import { useState } from 'react';
import type { BearingView, CaseDetail, FixView } from '@/lib/hunt/views';
import { CaseMapClient } from '@/components/map/case-map-client';
import { BearingForm } from '@/components/hunt/bearing-form';
import { CautionList } from '@/components/cautions';
import { DoorsSection } from '@/components/hunt/doors-section';
import { useDoors } from '@/components/hunt/use-doors';
import { BearingList } from '@/components/hunt/bearing-list';
import { useLevelTrails } from '@/components/field/use-level-trail';
import type { QueuedItem } from '@/lib/field/queue';
import { ConvergenceTrail } from './convergence-trail';
import { FixSummary } from '@/components/hunt/fix-summary';
import { CardSection } from './card-section';

type LatLon = { lat: number; lon: number };
/** The case page keeps no phone queue: its trails are what the server holds. */
const NO_QUEUE: QueuedItem[] = [];

/** The hunt: map (with the level trails of the walk and imported surveys), fix in words, how it converged, the bearings, and (for the hunter) adding one. */
export function HuntPanel({
  c,
  bearings,
  fix,
  error,
  refresh,
}: {
  c: CaseDetail;
  bearings?: BearingView[];
  fix?: FixView;
  error?: Error;
  refresh: () => Promise<unknown>;
}) {
  const [picked, setPicked] = useState<LatLon | null>(null);
  const doors = useDoors(c.id, fix, c.can.hunt);
  const { trails } = useLevelTrails(c.id, NO_QUEUE, true);
  const current = fix?.current?.fix;
  const outlierIds = current?.ok ? current.outlierIds : [];
  return (
    <CardSection
      id="hunt"
      title="The hunt"
      testId="hunt-panel"
      aside={
        c.can.hunt && (
          <Link href={`/cases/${c.id}/field`} className="btn-primary" data-testid="field-screen-link">
            Open the field screen
          </Link>
        )
      }
    >
      {error && <p className="font-semibold text-alarm-600">Part of the hunt could not be loaded: {error.message} It is retried every few seconds.</p>}
      <CaseMapClient
        bearings={bearings ?? []}
        fix={fix}
        reportedPosition={c.reportedPosition ?? null}
        selectedPosition={c.can.hunt ? picked : null}
        onMapTap={c.can.hunt ? setPicked : undefined}
        onSpotSelect={c.can.hunt ? (s) => setPicked({ lat: s.lat, lon: s.lon }) : undefined}
        places={doors.highlight}
        focus={doors.focus}
        levelTrails={trails}
        className="h-80"
      />
      {c.can.hunt && <p className="text-sm text-ink-soft">Tap the map, or a suggested spot, to set where the next bearing is taken from.</p>}
      <FixSummary fix={fix} bearings={bearings ?? []} />
      <DoorsSection doors={doors} canConfirm={c.can.hunt} point={picked} onConfirmed={refresh} />
      {fix && <ConvergenceTrail trail={fix.trail} />}
      {bearings ? (
        <BearingList caseId={c.id} bearings={bearings} outlierIds={outlierIds} canEdit={c.can.hunt} refresh={refresh} detail />
      ) : (
        <p className="text-ink-soft">Loading the bearings…</p>
      )}
      {c.can.hunt && (
        <section className="space-y-3 border-t border-ink/10 pt-3" aria-labelledby="add-bearing-heading" data-testid="add-bearing">
          <h3 id="add-bearing-heading" className="font-bold">
            Add bearing
          </h3>
          <CautionList compact />
          <BearingForm
            caseId={c.id}
            caseDetail={c}
            selectedPosition={picked}
            onSaved={() => {
              setPicked(null);
              void refresh();
            }}
          />
        </section>
      )}
    </CardSection>
  );
}
