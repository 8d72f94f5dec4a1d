'use client';

import { useMemo } from 'react';
import { suggestNextSpots, type NextSpot } from '@/lib/df';
import { nextSpotOptions, toLines } from '@/lib/hunt/bearing-math';
import type { BearingView } from '@/lib/hunt/views';
import { formatApproxMetres } from '@/components/map/map-geometry';

/**
 * Where to stand next, as a list under the fix (never over it). With the phone's position the
 * spots are worked out on the phone (lib/df suggestNextSpots with `from`: spots within a walk are
 * preferred) and each shows its walking distance (straight line) from where the hunter stands;
 * without it, the server's spots (from the last bearing's spot).
 */
export function NextSpotsList({ bearings, serverSpots, from, onPick }: { bearings: BearingView[]; serverSpots: NextSpot[]; from: { lat: number; lon: number } | null; onPick: (s: NextSpot) => void }) {
  const spots = useMemo(() => {
    const lines = toLines(bearings);
    return from && lines.length ? suggestNextSpots(lines, { ...nextSpotOptions(bearings), from }) : serverSpots;
  }, [bearings, serverSpots, from]);
  if (!spots.length) return null;
  return (
    <section aria-label="Next spots" className="card space-y-2" data-testid="next-spots">
      <h2 className="text-lg font-bold">Where to stand next</h2>
      <ul className="space-y-1">
        {spots.map((s, i) => (
          <li key={`${s.lat},${s.lon}`}>
            <button type="button" className="btn-quiet flex min-h-12 w-full items-center justify-between gap-2 text-left" onClick={() => onPick(s)}>
              <span>
                Spot {i + 1}: ellipse {formatApproxMetres(s.expectedSemiMajorM)} expected
              </span>
              <span className="font-bold tabular-nums" data-testid="spot-distance">
                {from && s.walkM !== undefined ? `${formatApproxMetres(s.walkM)} from you` : 'waiting for your position'}
              </span>
            </button>
          </li>
        ))}
      </ul>
      <p className="text-sm text-ink-soft">Straight-line distance; stay on public ground on the way.</p>
    </section>
  );
}
