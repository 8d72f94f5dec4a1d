'use client';

import { createContext, useContext } from 'react';

/** The map's run-time settings, read by the server (lib/env) and handed to the page. */
export type MapSettings = { tileUrl: string; tileAttribution: string };

const MapSettingsContext = createContext<MapSettings>({ tileUrl: '', tileAttribution: '' });

export function MapSettingsProvider({ settings, children }: { settings: MapSettings; children: React.ReactNode }) {
  return <MapSettingsContext.Provider value={settings}>{children}</MapSettingsContext.Provider>;
}

export function useMapSettings(): MapSettings {
  return useContext(MapSettingsContext);
}
