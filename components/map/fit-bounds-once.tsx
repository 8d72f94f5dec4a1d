'use client';

import { useEffect, useRef } from 'react';
import { useMap } from 'react-leaflet';
import { latLngBounds } from 'leaflet';

/** Closest zoom used when fitting (about street level) and for a single point. */
const MAX_FIT_ZOOM = 17;

/**
 * Fits the view to `points` ([lat, lon] degrees): when they first appear, once more when
 * `complete` turns true (all data loaded) if the first fit came from partial data, and again
 * whenever `refitKey` changes (a line was added or removed). Plain refreshes never move the map
 * the hunter may have panned.
 */
export function FitBoundsOnce({ points, complete, refitKey }: { points: [number, number][]; complete: boolean; refitKey?: string | number }) {
  const map = useMap();
  const state = useRef<'none' | 'partial' | 'full'>('none');
  const lastKey = useRef(refitKey);
  useEffect(() => {
    if (refitKey !== lastKey.current) {
      lastKey.current = refitKey;
      if (state.current === 'full') state.current = 'partial';
    }
    if (points.length === 0 || state.current === 'full' || (state.current === 'partial' && !complete)) return;
    const bounds = latLngBounds(points);
    if (points.length === 1 || bounds.getNorthEast().equals(bounds.getSouthWest())) map.setView(bounds.getCenter(), 16);
    else map.fitBounds(bounds, { padding: [28, 28], maxZoom: MAX_FIT_ZOOM });
    state.current = complete ? 'full' : 'partial';
  }, [map, points, complete, refitKey]);
  return null;
}
