'use client';

import { useEffect } from 'react';
import { useMap } from 'react-leaflet';

/** Where the map should go when asked (e.g. "show this house"); a new `key` moves it again. */
export type MapFocus = { lat: number; lon: number; zoom: number; key: string };

/** Moves the map to `focus` each time its key changes. Render inside a MapContainer. */
export function FlyTo({ focus }: { focus?: MapFocus | null }) {
  const map = useMap();
  useEffect(() => {
    if (focus) map.setView([focus.lat, focus.lon], focus.zoom, { animate: false });
    // only a new key moves the map
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focus?.key, map]);
  return null;
}
