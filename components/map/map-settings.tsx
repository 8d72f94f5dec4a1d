'use client';

import { createContext, useContext } from 'react';

/** The map's run-time settings, read by the server (lib/env) and handed to the page. */
/** `places`: whether the signed-in person may load the places layer (hunters and the committee). */
/** `tilePrefetchMax`: tiles "Prepare for the field" may fetch ahead (0: the tile server does not allow it). */
export type MapSettings = { tileUrl: string; tileAttribution: string; places: boolean; tilePrefetchMax: number };

const MapSettingsContext = createContext<MapSettings>({ tileUrl: '', tileAttribution: '', places: false, tilePrefetchMax: 0 });

export function MapSettingsProvider({ settings, children }: { settings: MapSettings; children: React.ReactNode }) {
  return <MapSettingsContext.Provider value={settings}>{children}</MapSettingsContext.Provider>;
}

export function useMapSettings(): MapSettings {
  return useContext(MapSettingsContext);
}
