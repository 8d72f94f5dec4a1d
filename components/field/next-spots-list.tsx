'use client';

import { distance } from '@turf/turf';
import type { NextSpot } from '@/lib/df';
import { formatApproxMetres } from '@/components/map/map-geometry';

/**
 * Where to stand next, as a list under the fix (never over it): each spot's expected ellipse and
 * how far it is from where the hunter stands (straight line, turf; a street route is longer).
 */
export function NextSpotsList({ spots, from, onPick }: { spots: NextSpot[]; from: { lat: number; lon: number } | null; onPick: (s: NextSpot) => void }) {
  if (!spots.length) return null;
  const rows = spots
    .map((s) => ({ s, m: from ? distance([from.lon, from.lat], [s.lon, s.lat], { units: 'meters' }) : null }))
    .sort((a, b) => (a.m ?? 0) - (b.m ?? 0));
  return (
    <section aria-label="Next spots" className="card space-y-2" data-testid="next-spots">
      <h2 className="text-lg font-bold">Where to stand next</h2>
      <ul className="space-y-1">
        {rows.map(({ s, m }, i) => (
          <li key={`${s.lat},${s.lon}`}>
            <button type="button" className="btn-quiet flex min-h-12 w-full items-center justify-between gap-2 text-left" onClick={() => onPick(s)}>
              <span>Spot {i + 1}: ellipse {formatApproxMetres(s.expectedSemiMajorM)} expected</span>
              <span className="font-bold tabular-nums" data-testid="spot-distance">
                {m === null ? 'distance: waiting for your position' : `${formatApproxMetres(m)} from you`}
              </span>
            </button>
          </li>
        ))}
      </ul>
      <p className="text-sm text-ink-soft">Straight-line distance; stay on public ground on the way.</p>
    </section>
  );
}
