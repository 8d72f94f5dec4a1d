'use client';

import { useEffect, useRef } from 'react';
import { useMap, useMapEvents } from 'react-leaflet';
import { latLngBounds } from 'leaflet';

/** Closest zoom used when fitting (about street level) and for a single point. */
const MAX_FIT_ZOOM = 17;

/**
 * Fits the view to `points` ([lat, lon] degrees): when they first appear, once more when
 * `complete` turns true (all data loaded) if the first fit came from partial data, and again
 * whenever `refitKey` changes (a line was added or removed). Plain refreshes never move the map
 * the hunter may have panned. Once the hunter chose a view (a drag, or a new `holdKey`: "show this
 * house"), the map no longer fits by itself: late data or a new line never yanks it away.
 */
export function FitBoundsOnce({
  points,
  complete,
  refitKey,
  holdKey,
}: {
  points: [number, number][];
  complete: boolean;
  refitKey?: string | number;
  holdKey?: string | null;
}) {
  const map = useMap();
  // A map (re)mounted with a focus already set shows that focus (FlyTo) and is held from the start.
  const state = useRef<'none' | 'partial' | 'full' | 'held'>(holdKey ? 'held' : 'none');
  const lastKey = useRef(refitKey);
  const lastHold = useRef(holdKey);
  useMapEvents({
    dragstart: () => {
      if (state.current !== 'none') state.current = 'held';
    },
  });
  useEffect(() => {
    if (holdKey !== lastHold.current) {
      lastHold.current = holdKey;
      if (holdKey) state.current = 'held';
    }
    if (refitKey !== lastKey.current) {
      lastKey.current = refitKey;
      if (state.current === 'full') state.current = 'partial';
      // 'held': the hunter chose this view; data arriving or lines added never take it away.
    }
    if (points.length === 0 || state.current === 'full' || state.current === 'held' || (state.current === 'partial' && !complete)) return;
    const bounds = latLngBounds(points);
    // Never animated: a zoom animation still running when the next move comes (the hunter's "show
    // this house", a fit for complete data) ends by putting the map back where it was heading,
    // undoing that move (on a busy phone the animation's end can come seconds late).
    if (points.length === 1 || bounds.getNorthEast().equals(bounds.getSouthWest())) map.setView(bounds.getCenter(), 16, { animate: false });
    else map.fitBounds(bounds, { padding: [28, 28], maxZoom: MAX_FIT_ZOOM, animate: false });
    state.current = complete ? 'full' : 'partial';
  }, [map, points, complete, refitKey, holdKey]);
  return null;
}
