/**
 * The one place that decides how each kind of map item looks, so the map and its legend agree.
 * Colours come from the Quietfix palette (tailwind.config.ts); dash patterns keep kinds apart
 * without relying on colour alone. Weights are in CSS pixels.
 */
import type { PathOptions } from 'leaflet';

export const PALETTE = {
  ink: '#0f1d2b',
  inkSoft: '#33475b',
  inkFaint: '#5b6f82',
  paper: '#fbfaf6',
  hush700: '#0b5e55',
  hush900: '#06352f',
  flare500: '#c8780a',
  flare700: '#8a4f00',
  alarm600: '#b3261e',
  alarm800: '#7a140f',
} as const;

/** Plain background shown when map tiles are off or fail. */
export const PLAIN_BACKGROUND = '#f3f5f1';

export type LineKind = 'bearing' | 'outlier' | 'excluded' | 'ellipse' | 'ellipseAlt' | 'trail' | 'grid' | 'street' | 'building' | 'candidate' | 'premises';

export const LINE_STYLES: Record<LineKind, PathOptions> = {
  bearing: { color: PALETTE.hush700, weight: 3, opacity: 0.95 },
  outlier: { color: PALETTE.flare500, weight: 4, opacity: 1, dashArray: '14 5 3 5' },
  excluded: { color: PALETTE.inkFaint, weight: 2, opacity: 0.5, dashArray: '4 8' },
  ellipse: { color: PALETTE.alarm600, weight: 2.5, fillColor: PALETTE.alarm600, fillOpacity: 0.12 },
  ellipseAlt: { color: PALETTE.alarm800, weight: 2, dashArray: '8 6', fill: false },
  trail: { color: PALETTE.inkSoft, weight: 1.5, opacity: 0.9 },
  grid: { color: '#9aa8b5', weight: 1, opacity: 0.7 },
  // The places layer: quiet enough to sit under the hunt's geometry.
  street: { color: '#c9cfc4', weight: 9, opacity: 1, lineCap: 'round' },
  building: { color: '#8d8a80', weight: 1, fillColor: '#dcd6c8', fillOpacity: 0.9 },
  candidate: { color: PALETTE.flare700, weight: 2.5, fillColor: '#f2c879', fillOpacity: 0.95 },
  premises: { color: PALETTE.alarm800, weight: 3.5, fillColor: '#e9a39e', fillOpacity: 0.95 },
};
