'use client';

import { useState } from 'react';
import { NoticeBox } from '@/components/ui/notice-box';
import { callApi } from '@/lib/api/client';
import type { BearingView } from '@/lib/hunt/views';

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/**
 * This case's bearings, newest first, compact; each can be left out of the fix ("Exclude") and
 * put back ("Include"). Uses the bearing's version so a change by someone else is not overwritten.
 */
export function BearingList({
  caseId,
  bearings,
  outlierIds,
  canEdit,
  onChanged,
}: {
  caseId: string;
  bearings: BearingView[];
  outlierIds: string[];
  canEdit: boolean;
  onChanged: () => void | Promise<void>;
}) {
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const sorted = [...bearings].sort((a, b) => b.takenAt.localeCompare(a.takenAt));

  const toggle = async (b: BearingView) => {
    setBusy(b.id);
    setError(null);
    const r = await callApi(`/api/cases/${caseId}/bearings/${b.id}`, { method: 'PATCH', body: { version: b.version, excluded: !b.excluded } });
    setBusy(null);
    if (!r.ok) setError(r.status === 409 ? `${r.error} The list has been refreshed; try again if still needed.` : r.error);
    await onChanged();
  };

  return (
    <section aria-labelledby="bearings-heading" className="space-y-2">
      <h2 id="bearings-heading" className="text-lg font-bold">
        Bearings ({bearings.length})
      </h2>
      {error && <NoticeBox tone="error">{error}</NoticeBox>}
      {sorted.length === 0 ? (
        <p className="text-ink-soft">No bearings yet.</p>
      ) : (
        <ul className="divide-y divide-ink/10 rounded-xl border border-ink/10 bg-white" data-testid="bearing-list">
          {sorted.map((b) => {
            const outlier = outlierIds.includes(b.id);
            const what = `${b.azimuthTrueDeg.toFixed(1)}° true, ${time(b.takenAt)}`;
            return (
              <li key={b.id} className={`flex items-center gap-2 px-3 py-2 ${b.excluded ? 'text-ink-faint' : ''}`} data-bearing-id={b.id}>
                <div className="min-w-0 flex-1">
                  <p className={`font-bold tabular-nums ${b.excluded ? 'line-through' : ''}`}>
                    {b.azimuthTrueDeg.toFixed(1)}° <span className="font-normal">±{b.sigmaDeg.toFixed(1)}°</span>
                  </p>
                  <p className="truncate text-sm">
                    {time(b.takenAt)}
                    {b.author ? ` · ${b.author.callSign ?? b.author.name}` : ''}
                    {b.sweep ? ' · sweep' : ''}
                    {b.oneWay ? ' · one-way' : ''}
                  </p>
                </div>
                {outlier && !b.excluded && <span className="rounded bg-flare-100 px-2 py-0.5 text-sm font-bold text-flare-700">outlier</span>}
                {b.excluded && <span className="rounded bg-paper-deep px-2 py-0.5 text-sm font-semibold text-ink-soft">excluded</span>}
                {canEdit && (
                  <button
                    type="button"
                    className="btn-quiet min-w-24"
                    disabled={busy === b.id}
                    aria-label={`${b.excluded ? 'Include' : 'Exclude'} bearing ${what}`}
                    onClick={() => void toggle(b)}
                  >
                    {b.excluded ? 'Include' : 'Exclude'}
                  </button>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
