'use client';

import { useCallback, useMemo, useState } from 'react';
import { Marker, Polyline, useMap, useMapEvents } from 'react-leaflet';
import type { LatLngBounds } from 'leaflet';
import { formatGridLabel, gridSpacingDeg, gridValues } from './grid-lines';
import { gridLabelIcon } from './map-icons';
import { LINE_STYLES } from './map-styles';

/** Web Mercator stops short of the poles; the grid does too (degrees). */
const MAX_LAT = 85;

type Grid = { latStep: number; lonStep: number; lats: number[]; lons: number[]; south: number; north: number; west: number; east: number };

function gridFor(b: LatLngBounds): Grid {
  const south = Math.max(b.getSouth(), -MAX_LAT);
  const north = Math.min(b.getNorth(), MAX_LAT);
  const west = b.getWest();
  const east = b.getEast();
  const latStep = gridSpacingDeg(north - south);
  const lonStep = gridSpacingDeg(east - west);
  return { latStep, lonStep, lats: gridValues(south, north, latStep), lons: gridValues(west, east, lonStep), south, north, west, east };
}

/**
 * Latitude/longitude lines with labels at a spacing that follows the zoom (about 3-6 lines
 * across), for reading positions when no map tiles are shown. Never interactive.
 */
export function CoordinateGrid() {
  const map = useMap();
  const [grid, setGrid] = useState<Grid>(() => gridFor(map.getBounds()));
  const update = useCallback(() => setGrid(gridFor(map.getBounds())), [map]);
  useMapEvents({ moveend: update, zoomend: update, resize: update });
  // Rebuilt only when the view changes, not on every data refresh of the map around it.
  return useMemo(() => <GridLayers grid={grid} />, [grid]);
}

function GridLayers({ grid }: { grid: Grid }) {
  const style = LINE_STYLES.grid;
  return (
    <>
      {grid.lats.map((lat) => (
        <Polyline key={`lat${lat}`} positions={[[lat, grid.west], [lat, grid.east]]} className="qf-grid" pathOptions={style} interactive={false} />
      ))}
      {grid.lons.map((lon) => (
        <Polyline key={`lon${lon}`} positions={[[grid.south, lon], [grid.north, lon]]} className="qf-grid" pathOptions={style} interactive={false} />
      ))}
      {grid.lats.map((lat) => (
        <Marker key={`latl${lat}`} position={[lat, grid.west]} icon={gridLabelIcon(formatGridLabel(lat, grid.latStep, 'lat'), 'left')} interactive={false} keyboard={false} />
      ))}
      {grid.lons.map((lon) => (
        <Marker key={`lonl${lon}`} position={[grid.north, lon]} icon={gridLabelIcon(formatGridLabel(lon, grid.lonStep, 'lon'), 'top')} interactive={false} keyboard={false} />
      ))}
    </>
  );
}
