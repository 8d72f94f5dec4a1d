'use client';

import type { BearingView } from '@/lib/hunt/views';
import { ActionMessageBox } from '@/components/ui/action-message';
import { degrees, formatTime, formatWhen, frequencyWords, metres } from '@/lib/hunt/words';
import { describeTrueAzimuth } from './azimuth-text';
import { formatLatLon } from './format-position';
import { useCaseAction } from './use-case-action';

/** "Cleo Marchetti, 14:05, 212.0° true": how a bearing is named in warnings, outlier lists and buttons. */
export const bearingName = (b: BearingView) => `${b.author?.name ?? 'unknown hunter'}, ${formatTime(b.takenAt)}, ${degrees(b.azimuthTrueDeg)} true`;

/** How a bearing was taken, line by line (the case page shows these; the field screen keeps to one line). */
function BearingDetails({ b }: { b: BearingView }) {
  return (
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
  );
}

function BearingItem({ b, outlier, detail, toggle, busy }: { b: BearingView; outlier: boolean; detail: boolean; toggle?: () => void; busy: boolean }) {
  const who = b.author ? (detail ? b.author.name : (b.author.callSign ?? b.author.name)) : 'unknown hunter';
  return (
    <li className={`rounded-lg border p-3 ${b.excluded ? 'border-dashed border-ink/30 bg-paper-deep text-ink-soft' : 'border-ink/15 bg-white'}`} data-testid="bearing-item" data-bearing-id={b.id}>
      <div className="flex flex-wrap items-baseline gap-x-2">
        <span className={`text-lg font-bold tabular-nums ${b.excluded ? 'line-through' : ''}`}>{degrees(b.azimuthTrueDeg)} true</span>
        <span>±{+b.sigmaDeg.toFixed(1)}°</span>
        {b.excluded && <span className="rounded-full border border-ink/40 px-2 text-xs font-bold uppercase">left out of the fix</span>}
        {outlier && !b.excluded && <span className="rounded-full border border-flare-500 bg-flare-100 px-2 text-xs font-bold text-flare-700 uppercase">outlier</span>}
      </div>
      <p className="text-sm text-ink-soft">
        <time dateTime={b.takenAt}>{detail ? formatWhen(b.takenAt) : formatTime(b.takenAt)}</time> · {who}
        {!detail && b.sweep ? ' · sweep' : ''}
        {!detail && b.oneWay ? ' · one-way' : ''}
      </p>
      {detail && <BearingDetails b={b} />}
      {toggle && (
        <button type="button" className="btn-quiet mt-2" onClick={toggle} disabled={busy} aria-label={`${b.excluded ? 'Use in the fix' : 'Leave out of the fix'}: ${bearingName(b)}`}>
          {b.excluded ? 'Use in the fix' : 'Leave out of the fix'}
        </button>
      )}
    </li>
  );
}

/**
 * Every bearing on the case, newest first (they are never deleted); whoever may hunt the case can
 * leave one out of the fix and put it back, with the bearing's version so a change by someone
 * else is not overwritten. `detail` shows how each was taken (the case page); without it, one
 * line each (the field screen).
 */
export function BearingList({
  caseId,
  bearings,
  outlierIds,
  canEdit,
  refresh,
  detail = false,
}: {
  caseId: string;
  bearings: BearingView[];
  outlierIds: string[];
  canEdit: boolean;
  refresh: () => Promise<unknown>;
  detail?: boolean;
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
      <h3 id="bearings-heading" className="text-lg font-bold">
        Bearings ({bearings.length})
      </h3>
      <ActionMessageBox message={action.message} />
      {sorted.length === 0 ? (
        <p className="text-ink-soft">No bearings yet.</p>
      ) : (
        <ul className="space-y-2" data-testid="bearing-list">
          {sorted.map((b) => (
            <BearingItem key={b.id} b={b} outlier={outlierIds.includes(b.id)} detail={detail} toggle={canEdit ? toggle(b) : undefined} busy={action.busy} />
          ))}
        </ul>
      )}
    </section>
  );
}
