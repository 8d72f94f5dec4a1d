'use client';

import { useMapEvents } from 'react-leaflet';

export type LatLon = { lat: number; lon: number };

/** Calls onTap with the tapped position (WGS84 degrees, longitude wrapped to -180..180). */
export function MapTap({ onTap }: { onTap?: (p: LatLon) => void }) {
  useMapEvents({
    click: (e) => {
      if (!onTap) return;
      const p = e.latlng.wrap();
      onTap({ lat: p.lat, lon: p.lng });
    },
  });
  return null;
}
