'use client';

import dynamic from 'next/dynamic';
import { MapLoading } from './map-loading';

/** The position picker, loaded in the browser only (Leaflet needs `window`). Same props as PositionPicker. */
export const PositionPickerClient = dynamic(() => import('./position-picker'), {
  ssr: false,
  loading: () => <MapLoading label="Loading the map…" />,
});
