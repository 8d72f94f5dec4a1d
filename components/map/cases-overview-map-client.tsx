'use client';

import dynamic from 'next/dynamic';
import { MapLoading } from './map-loading';

/** The map of all cases, loaded in the browser only (Leaflet needs `window`). */
export const CasesOverviewMapClient = dynamic(() => import('./cases-overview-map'), {
  ssr: false,
  loading: () => <MapLoading label="Loading the map of cases…" />,
});
