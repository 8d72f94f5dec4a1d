'use client';

import 'leaflet/dist/leaflet.css';
import L from 'leaflet';
import { useEffect, useMemo } from 'react';
import { CircleMarker, MapContainer, Marker, Polygon, Polyline, Rectangle, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import type { CaseStatus } from '@/db/types';
import type { MapCell } from '@/db/case-map';
import type { Area, Bbox } from '@/lib/validation/queue';
import { BaseLayers } from './base-layers';
import { PALETTE, PLAIN_BACKGROUND } from './map-styles';
import { STATUS_COLOURS, statusSymbolSvg } from './case-status-symbols';

export type MapView = { bbox: Bbox; zoom: number };

const caseIcons = new Map<CaseStatus, L.DivIcon>();
function caseIcon(status: CaseStatus) {
  let icon = caseIcons.get(status);
  if (!icon) {
    icon = L.divIcon({ className: `qf-case qf-case-${status}`, iconSize: [18, 18], iconAnchor: [9, 9], html: statusSymbolSvg(status) });
    caseIcons.set(status, icon);
  }
  return icon;
}
function clusterIcon(cell: MapCell) {
  const top = (Object.entries(cell.byStatus) as [CaseStatus, number][]).sort((a, b) => b[1] - a[1])[0][0];
  const size = cell.count < 10 ? 26 : cell.count < 100 ? 32 : cell.count < 1000 ? 38 : 44;
  return L.divIcon({
    className: 'qf-cluster',
    iconSize: [size, size],
    iconAnchor: [size / 2, size / 2],
    html: `<div style="width:${size}px;height:${size}px;border-radius:50%;background:#fff;border:4px solid ${STATUS_COLOURS[top]};display:flex;align-items:center;justify-content:center;font:700 11px system-ui;color:${PALETTE.ink}">${cell.count >= 1000 ? `${Math.round(cell.count / 100) / 10}k` : cell.count}</div>`,
  });
}

function ViewReporter({ onView }: { onView: (v: MapView) => void }) {
  const map = useMap();
  useEffect(() => {
    const report = () => {
      const b = map.getBounds();
      const clamp = (x: number, lim: number) => Math.max(-lim, Math.min(lim, x));
      onView({ bbox: { west: clamp(b.getWest(), 180), south: clamp(b.getSouth(), 90), east: clamp(b.getEast(), 180), north: clamp(b.getNorth(), 90) }, zoom: map.getZoom() });
    };
    report();
    map.on('moveend', report);
    return () => {
      map.off('moveend', report);
    };
  }, [map, onView]);
  return null;
}

/** While drawing, a tap on the map adds a vertex; the vertices so far show as a dashed line with dots. */
function AreaDraft({ draft, onPoint }: { draft: [number, number][] | null; onPoint: (lonLat: [number, number]) => void }) {
  useMapEvents({
    click(e) {
      if (draft) onPoint([e.latlng.lng, e.latlng.lat]);
    },
  });
  if (!draft?.length) return null;
  const positions = draft.map(([lon, lat]) => [lat, lon] as [number, number]);
  return (
    <>
      <Polyline positions={positions} className="qf-area-draft" pathOptions={{ color: PALETTE.hush900, weight: 2, dashArray: '4 4' }} interactive={false} />
      {positions.map((pos, i) => (
        <CircleMarker key={i} center={pos} radius={5} className="qf-area-vertex" pathOptions={{ color: PALETTE.hush900, weight: 2, fillColor: '#fff', fillOpacity: 1 }} interactive={false} />
      ))}
    </>
  );
}

export type CasesOverviewMapProps = {
  cells: MapCell[];
  heat: boolean;
  cellDeg: number;
  area?: Area;
  /** the vertices being drawn ([lon, lat]), or null when not drawing */
  draft: [number, number][] | null;
  start: { lat: number; lon: number; zoom: number };
  onView: (v: MapView) => void;
  onDraftPoint: (lonLat: [number, number]) => void;
  onOpenCase: (id: string) => void;
};

/** The map of all cases: server clusters, our status symbols, a heat view of open cases, the drawn area. */
export default function CasesOverviewMap(p: CasesOverviewMapProps) {
  const max = useMemo(() => Math.max(1, ...p.cells.map((c) => c.count)), [p.cells]);
  return (
    <div className={`relative isolate h-96 overflow-hidden rounded-lg border border-ink/20 ${p.draft ? 'qf-drawing cursor-crosshair' : ''}`}>
      <MapContainer center={[p.start.lat, p.start.lon]} zoom={p.start.zoom} className="h-full w-full" style={{ background: PLAIN_BACKGROUND }} attributionControl={false}>
        <BaseLayers />
        <ViewReporter onView={p.onView} />
        <AreaDraft draft={p.draft} onPoint={p.onDraftPoint} />
        {p.area && !p.draft && (
          <Polygon positions={p.area.vertices.map(([lon, lat]) => [lat, lon] as [number, number])} className="qf-area" pathOptions={{ color: PALETTE.hush900, weight: 2, dashArray: '6 4', fillOpacity: 0.05 }} interactive={false} />
        )}
        {p.heat
          ? p.cells.map((c, i) => (
              <Rectangle
                key={`h${i}`}
                bounds={[[c.lat - p.cellDeg / 2, c.lon - p.cellDeg / 2], [c.lat + p.cellDeg / 2, c.lon + p.cellDeg / 2]]}
                pathOptions={{ stroke: false, fillColor: PALETTE.alarm600, fillOpacity: 0.15 + 0.6 * (c.count / max), className: 'qf-heat' }}
              >
                <Tooltip>{c.count} open</Tooltip>
              </Rectangle>
            ))
          : p.cells.map((c, i) =>
              c.case ? (
                <Marker key={c.case.id} position={[c.lat, c.lon]} icon={caseIcon(c.case.status)} title={`${c.case.reference} ${c.case.title}`} eventHandlers={{ click: (e) => (p.draft ? p.onDraftPoint([e.latlng.lng, e.latlng.lat]) : p.onOpenCase(c.case!.id)) }}>
                  <Tooltip>{`${c.case.reference} · ${c.case.status} · ${c.case.title}`}</Tooltip>
                </Marker>
              ) : (
                <ClusterMarker key={`c${i}`} cell={c} onDrawPoint={p.draft ? p.onDraftPoint : undefined} />
              ),
            )}
      </MapContainer>
    </div>
  );
}

function ClusterMarker({ cell, onDrawPoint }: { cell: MapCell; onDrawPoint?: (lonLat: [number, number]) => void }) {
  const map = useMap();
  const click = (e: L.LeafletMouseEvent) => (onDrawPoint ? onDrawPoint([e.latlng.lng, e.latlng.lat]) : map.setView([cell.lat, cell.lon], Math.min(map.getZoom() + 2, 19)));
  return (
    <Marker position={[cell.lat, cell.lon]} icon={clusterIcon(cell)} eventHandlers={{ click }}>
      <Tooltip>{`${cell.count} cases: ${(Object.entries(cell.byStatus) as [string, number][]).filter(([, n]) => n).map(([s, n]) => `${n} ${s}`).join(', ')}`}</Tooltip>
    </Marker>
  );
}
