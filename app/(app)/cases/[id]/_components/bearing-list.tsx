'use client';

import type { BearingView } from '@/lib/hunt/views';
import { describeTrueAzimuth } from '@/components/hunt/azimuth-text';
import { formatLatLon } from '@/components/hunt/format-position';
import { ActionMessageBox } from './action-message';
import { useCaseAction } from './use-case-action';
import { bearingName } from './fix-summary';
import { degrees, formatWhen, frequencyWords, metres } from '@/lib/hunt/words';

function BearingItem({ b, outlier, toggle, busy }: { b: BearingView; outlier: boolean; toggle?: () => void; busy: boolean }) {
  return (
    <li className={`rounded-lg border p-3 ${b.excluded ? 'border-dashed border-ink/30 bg-paper-deep' : 'border-ink/15 bg-white'}`} data-testid="bearing-item">
      <div className="flex flex-wrap items-baseline gap-x-2">
        <span className="text-lg font-bold">{degrees(b.azimuthTrueDeg)} true</span>
        <span>±{+b.sigmaDeg.toFixed(1)}°</span>
        {b.excluded && <span className="rounded-full border border-ink/40 px-2 text-xs font-bold uppercase">left out of the fix</span>}
        {outlier && !b.excluded && <span className="rounded-full border border-flare-500 bg-flare-100 px-2 text-xs font-bold text-flare-700 uppercase">outlier</span>}
      </div>
      <p className="text-sm text-ink-soft">
        <time dateTime={b.takenAt}>{formatWhen(b.takenAt)}</time> · {b.author?.name ?? 'unknown hunter'}
      </p>
      <ul className="mt-1 space-y-0.5 text-sm">
        <li>Entered: {describeTrueAzimuth(b.azimuthEnteredDeg, b.reference, b.declinationDeg) ?? `${degrees(b.azimuthEnteredDeg)} ${b.reference}`}</li>
        {b.nullWidthDeg !== null && <li>Null width {degrees(b.nullWidthDeg)}</li>}
        <li>{b.frequencyKhz !== null ? frequencyWords(b.frequencyKhz) : 'Frequency not given'}</li>
        <li>{b.oneWay ? 'One-way (sense antenna used)' : 'Both ways along the line (loop null)'}</li>
        <li>
          From {formatLatLon(b.lat, b.lon)} ({b.positionSource === 'device' ? 'device' : 'map'}
          {b.positionAccuracyM !== null && `, within ${metres(b.positionAccuracyM)}`})
        </li>
        {b.sweep && <li>From a rotation sweep of {b.sweep.samples.length} readings</li>}
        <li>Revisions: {b.revisions}</li>
        {b.note && <li className="whitespace-pre-line">Note: {b.note}</li>}
      </ul>
      {toggle && (
        <button type="button" className="btn-quiet mt-2" onClick={toggle} disabled={busy} aria-label={`${b.excluded ? 'Use in the fix' : 'Leave out of the fix'}: ${bearingName(b)}`}>
          {b.excluded ? 'Use in the fix' : 'Leave out of the fix'}
        </button>
      )}
    </li>
  );
}

/** Every bearing on the case, newest first; a hunter on the case can leave one out of the fix. */
export function BearingList({
  caseId,
  bearings,
  outlierIds,
  canHunt,
  refresh,
}: {
  caseId: string;
  bearings: BearingView[];
  outlierIds: string[];
  canHunt: boolean;
  refresh: () => Promise<unknown>;
}) {
  const action = useCaseAction(refresh);
  const sorted = [...bearings].sort((a, b) => b.takenAt.localeCompare(a.takenAt));
  const toggle = (b: BearingView) => () =>
    action.run(
      `/api/cases/${caseId}/bearings/${b.id}`,
      { method: 'PATCH', body: { version: b.version, excluded: !b.excluded } },
      b.excluded ? `The bearing ${degrees(b.azimuthTrueDeg)} is back in the fix.` : `The bearing ${degrees(b.azimuthTrueDeg)} is left out of the fix.`,
    );
  return (
    <section className="space-y-2" aria-labelledby="bearings-heading">
      <h3 id="bearings-heading" className="font-bold">
        Bearings ({bearings.length})
      </h3>
      <ActionMessageBox message={action.message} />
      {bearings.length === 0 ? (
        <p className="text-ink-soft">No bearings yet.</p>
      ) : (
        <ul className="space-y-2" data-testid="bearing-list">
          {sorted.map((b) => (
            <BearingItem key={b.id} b={b} outlier={outlierIds.includes(b.id)} toggle={canHunt ? toggle(b) : undefined} busy={action.busy} />
          ))}
        </ul>
      )}
    </section>
  );
}
