'use client';

import { useMemo } from 'react';
import { Marker } from 'react-leaflet';
import { labelledPointIcon } from './map-icons';
import type { LatLon } from './map-tap';

/** The position chosen on the map for the next bearing: a crosshair with a label. */
export function PickedPositionMarker({ position, label = 'chosen position' }: { position: LatLon; label?: string }) {
  const icon = useMemo(() => labelledPointIcon('picked', label), [label]);
  return <Marker position={[position.lat, position.lon]} icon={icon} keyboard={false} interactive={false} />;
}
