'use client';

import { formatLatLon } from '@/components/hunt/format-position';
import { dbmToSUnits } from '@/lib/df';
import type { LevelTrailProps } from '@/components/map/level-trail-layer';

/**
 * The walk's smoothed level peak, offered as the place to confirm the premises from, with the
 * cautions on screen.
 */
export function TrailPeakCard({ trail, onUse }: { trail: LevelTrailProps | null; onUse: (p: { lat: number; lon: number }) => void }) {
  if (!trail?.peak) return null;
  const { peak, points } = trail;
  return (
    <section aria-label="Level peak" className="card space-y-2" data-testid="trail-peak">
      <h2 className="text-lg font-bold">Level peak of the walk</h2>
      <p>
        <span className="text-2xl font-extrabold tabular-nums text-ink">{Math.round(peak.levelDbm)} dBm</span>{' '}
        <span className="text-ink-soft">({dbmToSUnits(peak.levelDbm, 7e6).label} on HF, smoothed over neighbouring readings)</span>
      </p>
      <p className="text-base">
        Near {formatLatLon(peak.lat, peak.lon)}, from {points.length} {points.length === 1 ? 'reading' : 'readings'}.
      </p>
      <button type="button" className="btn-primary min-h-12 w-full" onClick={() => onUse({ lat: peak.lat, lon: peak.lon })}>
        Confirm the premises from here
      </button>
      <p className="rounded-lg bg-flare-100 px-3 py-2 text-ink" role="note">
        Stay on public ground; never enter a property or touch anyone’s equipment. A peak points to where to listen closely — it is not an accusation.
      </p>
    </section>
  );
}
