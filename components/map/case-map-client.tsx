'use client';

import dynamic from 'next/dynamic';
import { MapLoading } from './map-loading';

/** The case map, loaded in the browser only (Leaflet needs `window`). Same props as CaseMap. */
export const CaseMapClient = dynamic(() => import('./case-map'), {
  ssr: false,
  loading: () => <MapLoading label="Loading the case map…" />,
});
