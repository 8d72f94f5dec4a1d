'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { Pane, Polygon, Polyline, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import L, { type LatLngExpression } from 'leaflet';
import type { Geometry, Position } from 'geojson';
import type { PlaceFeature } from '@/db/places';
import { LINE_STYLES } from './map-styles';

/** What the case map asks the places layer to mark: candidate houses, the confirmed premises, picking a building. */
export type PlacesHighlight = {
  candidateIds?: ReadonlySet<string>;
  premisesPlaceId?: string | null;
  pickedPlaceId?: string | null;
  onPick?: (f: PlaceFeature) => void;
};

/** Largest box asked of /api/places (degrees a side; the API refuses more than 0.05). */
const MAX_BOX_DEG = 0.045;
/** House numbers and street names from this zoom on. */
export const LABEL_ZOOM = 17;
const STREET_NAME_ZOOM = 16;

const toLatLngs = (ring: Position[]): LatLngExpression[] => ring.map(([lon, lat]) => [lat, lon] as [number, number]);

function polygons(g: Geometry): LatLngExpression[][][] {
  if (g.type === 'Polygon') return [g.coordinates.map(toLatLngs)];
  if (g.type === 'MultiPolygon') return g.coordinates.map((p) => p.map(toLatLngs));
  return [];
}

function lines(g: Geometry): LatLngExpression[][] {
  if (g.type === 'LineString') return [toLatLngs(g.coordinates)];
  if (g.type === 'MultiLineString') return g.coordinates.map(toLatLngs);
  return [];
}

/** The box around the view, shrunk around its centre to what the API serves. */
function viewBox(map: L.Map): string {
  const b = map.getBounds();
  const c = b.getCenter();
  const halfLon = Math.min((b.getEast() - b.getWest()) / 2, MAX_BOX_DEG / 2);
  const halfLat = Math.min((b.getNorth() - b.getSouth()) / 2, MAX_BOX_DEG / 2);
  const f = (x: number) => x.toFixed(6);
  return [f(c.lng - halfLon), f(Math.max(c.lat - halfLat, -90)), f(c.lng + halfLon), f(Math.min(c.lat + halfLat, 90))].join(',');
}

/**
 * The club's streets and buildings (from /api/places) under the hunt's geometry: street lines with
 * names, building outlines, and house numbers at street zoom. Fetched for the view from `minZoom` on.
 */
export function PlacesLayer({ minZoom, highlight }: { minZoom: number; highlight?: PlacesHighlight }) {
  const map = useMap();
  const [zoom, setZoom] = useState(map.getZoom());
  const [features, setFeatures] = useState<PlaceFeature[]>([]);
  // What the drawn places must credit (OpenStreetMap's "© contributors" for imported OSM data).
  const [attribution, setAttribution] = useState<string[]>([]);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const pending = useRef<AbortController | null>(null);

  const load = useCallback(() => {
    const z = map.getZoom();
    setZoom(z);
    clearTimeout(timer.current);
    if (z < minZoom) {
      setAttribution([]);
      return setFeatures([]);
    }
    timer.current = setTimeout(async () => {
      pending.current?.abort();
      const ctl = new AbortController();
      pending.current = ctl;
      try {
        const res = await fetch(`/api/places?bbox=${viewBox(map)}`, { signal: ctl.signal, headers: { accept: 'application/json' } });
        if (res.ok) {
          const answer = (await res.json()) as { features: PlaceFeature[]; attribution?: string[] };
          setFeatures(answer.features);
          setAttribution(answer.attribution ?? []);
        }
      } catch {
        /* offline or aborted: keep what is drawn */
      }
    }, 200);
  }, [map, minZoom]);

  useEffect(() => {
    load();
    return () => {
      clearTimeout(timer.current);
      pending.current?.abort();
    };
  }, [load]);
  useMapEvents({ moveend: load, zoomend: load });
  const credit = attribution.join(' · ');
  useEffect(() => {
    const control = map.attributionControl;
    if (!credit || !control) return;
    control.addAttribution(credit);
    return () => void control.removeAttribution(credit);
  }, [map, credit]);

  if (features.length === 0) return null;
  const styleOf = (id: string) =>
    id === highlight?.premisesPlaceId || id === highlight?.pickedPlaceId ? LINE_STYLES.premises : highlight?.candidateIds?.has(id) ? LINE_STYLES.candidate : LINE_STYLES.building;
  return (
    <Pane name="places" style={{ zIndex: 350 }}>
      {features
        .filter((f) => f.properties.kind === 'street')
        .map((f) =>
          lines(f.geometry).map((l, i) => (
            <Polyline key={`${f.id}-${i}`} positions={l} className="qf-street" interactive={false} pathOptions={LINE_STYLES.street}>
              {zoom >= STREET_NAME_ZOOM && f.properties.name && i === 0 && (
                <Tooltip permanent direction="center" className="qf-street-name" pane="tooltipPane">
                  {f.properties.name}
                </Tooltip>
              )}
            </Polyline>
          )),
        )}
      {features
        .filter((f) => f.properties.kind === 'building')
        .map((f) => (
          <Polygon
            key={`${f.id}-${styleOf(f.id) === LINE_STYLES.building ? 'b' : 'h'}-${highlight?.onPick ? 'p' : ''}`}
            positions={polygons(f.geometry)}
            // Leaflet sets className and interactive only when a path is created: the key re-creates it when they change.
            className={highlight?.candidateIds?.has(f.id) ? 'qf-building qf-candidate' : 'qf-building'}
            interactive={!!highlight?.onPick}
            pathOptions={styleOf(f.id)}
            eventHandlers={
              highlight?.onPick
                ? {
                    click: (e) => {
                      L.DomEvent.stopPropagation(e);
                      highlight.onPick?.(f);
                    },
                  }
                : undefined
            }
          >
            {zoom >= LABEL_ZOOM && f.properties.housenumber && (
              <Tooltip permanent direction="center" className="qf-house-number" pane="tooltipPane">
                {f.properties.housenumber}
              </Tooltip>
            )}
          </Polygon>
        ))}
    </Pane>
  );
}
