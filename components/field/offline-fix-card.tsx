'use client';

import { useMemo } from 'react';
import type { QueuedItem } from '@/lib/field/queue';
import type { BearingView } from '@/lib/hunt/views';
import { offlineFix } from './offline-fix';

/**
 * The fix including the lines still waiting on the phone, computed in the browser by lib/df, and
 * plainly marked "not yet sent". Nothing shows when nothing waits.
 */
export function OfflineFixCard({ bearings, queued }: { bearings: BearingView[]; queued: QueuedItem[] }) {
  const r = useMemo(() => offlineFix(bearings, queued), [bearings, queued]);
  if (!r) return null;
  return (
    <section aria-label="Fix with lines not yet sent" className="card space-y-1 border-2 border-dashed border-flare-700" data-testid="offline-fix">
      <p className="text-sm font-bold uppercase tracking-wide text-flare-700">Not yet sent · computed on this phone</p>
      {r.fix.ok ? (
        <>
          <p className="text-3xl font-extrabold tabular-nums text-ink">±{Math.round(r.fix.ellipse.semiMajorM)} m</p>
          <p>
            95 % error ellipse from {r.lines} lines, {r.pending} of them still waiting to be sent. The server recomputes it when they arrive.
          </p>
        </>
      ) : (
        <p>
          {r.lines} lines ({r.pending} waiting): {r.fix.message}
        </p>
      )}
    </section>
  );
}
