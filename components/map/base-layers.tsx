'use client';

import { useMemo, useState } from 'react';
import { ScaleControl, TileLayer, AttributionControl } from 'react-leaflet';
import { CoordinateGrid } from './coordinate-grid';

/**
 * Tile server URL template and its attribution, from the build environment. An empty URL (the
 * default) turns tiles off: the map then shows geometry only.
 */
const TILE_URL = process.env.NEXT_PUBLIC_TILE_URL ?? '';
const TILE_ATTRIBUTION = process.env.NEXT_PUBLIC_TILE_ATTRIBUTION ?? '';

/** Tiles count as failed when the first errors come before any tile loads, or errors keep outnumbering loads. */
const ERRORS_BEFORE_GIVING_UP = 4;

/**
 * What every Quietfix map has under its geometry: the tiles when configured and loading, else a
 * coordinate grid and a visible "tiles are off" note; always a metric scale bar.
 * Render inside a MapContainer (the note is positioned over the map).
 */
export function BaseLayers() {
  const [count, setCount] = useState({ loaded: 0, errors: 0 });
  const failed = count.errors > 0 && (count.loaded === 0 || (count.errors >= ERRORS_BEFORE_GIVING_UP && count.errors > count.loaded));
  const tilesOn = TILE_URL !== '' && !failed;
  const handlers = useMemo(
    () => ({
      tileload: () => setCount((c) => ({ ...c, loaded: c.loaded + 1 })),
      tileerror: () => setCount((c) => ({ ...c, errors: c.errors + 1 })),
    }),
    [],
  );
  return (
    <>
      {/* Our own prefix: the library's name only, no flag or other symbol. */}
      <AttributionControl prefix="Leaflet" />
      {tilesOn ? <TileLayer url={TILE_URL} attribution={TILE_ATTRIBUTION} eventHandlers={handlers} /> : <CoordinateGrid />}
      <ScaleControl position="bottomleft" metric imperial={false} />
      {!tilesOn && (
        <p
          data-testid="tiles-off"
          className="pointer-events-none absolute top-2 right-2 z-[1000] rounded-md border border-ink/20 bg-white/95 px-2 py-1 text-xs font-semibold text-ink"
        >
          {TILE_URL === '' ? 'Map tiles are off — geometry only' : 'Map tiles did not load — geometry only'}
        </p>
      )}
    </>
  );
}
