'use client';

import { useMemo, useState } from 'react';
import { ScaleControl, TileLayer, AttributionControl } from 'react-leaflet';
import { CoordinateGrid } from './coordinate-grid';
import { useMapSettings } from './map-settings';
import { LABEL_ZOOM, PlacesLayer, type PlacesHighlight } from './places-layer';

/** Tiles count as failed when the first errors come before any tile loads, or errors keep outnumbering loads. */
const ERRORS_BEFORE_GIVING_UP = 4;
/** Without tiles the places layer is the map from this zoom on; with tiles it goes on top at street zoom. */
const PLACES_ZOOM_WITHOUT_TILES = 15;

/**
 * What every Quietfix map has under its geometry: the tile server the club configured (TILE_URL,
 * read at run time) when it loads, else a coordinate grid and a visible "no tiles" note; the
 * club's places layer (streets, buildings, house numbers); always a metric scale bar.
 * Render inside a MapContainer (the note is positioned over the map).
 */
export function BaseLayers({ places }: { places?: PlacesHighlight }) {
  const { tileUrl, tileAttribution, places: placesAllowed } = useMapSettings();
  const [count, setCount] = useState({ loaded: 0, errors: 0 });
  const failed = count.errors > 0 && (count.loaded === 0 || (count.errors >= ERRORS_BEFORE_GIVING_UP && count.errors > count.loaded));
  const tilesOn = tileUrl !== '' && !failed;
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
      {tilesOn ? <TileLayer url={tileUrl} attribution={tileAttribution} eventHandlers={handlers} /> : <CoordinateGrid />}
      {placesAllowed && <PlacesLayer minZoom={tilesOn ? LABEL_ZOOM : PLACES_ZOOM_WITHOUT_TILES} highlight={places} />}
      <ScaleControl position="bottomleft" metric imperial={false} />
      {/* Right-aligned and narrower than the map by the zoom buttons' room (top left), so on a phone it never covers them. */}
      {!tilesOn && (
        <p
          data-testid="tiles-off"
          className="pointer-events-none absolute top-2 right-2 z-[1000] max-w-[calc(100%_-_3.75rem)] rounded-md border border-ink/20 bg-white/95 px-2 py-1 text-xs font-semibold text-ink"
        >
          {tileUrl === '' ? 'No map tiles' : 'Map tiles did not load'}
          {placesAllowed ? ' — streets and houses from the club’s places' : ' — geometry only'}
        </p>
      )}
    </>
  );
}
