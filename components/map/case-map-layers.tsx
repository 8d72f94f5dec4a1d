'use client';

import { useMemo } from 'react';
import { Marker, Polygon, Polyline, Tooltip, CircleMarker } from 'react-leaflet';
import type { LeafletKeyboardEvent } from 'leaflet';
import { ellipsePolygon, geodesicLine, type Ellipse, type NextSpot } from '@/lib/df';
import type { BearingView, FixView } from '@/lib/hunt/views';
import { bearingDrawLengthM, formatApproxMetres } from './map-geometry';
import { crossIcon, fixIcon, labelledPointIcon, observerIcon, spotIcon } from './map-icons';
import { LINE_STYLES } from './map-styles';
import type { LatLon } from './map-tap';

/** Segments drawn per side of a bearing line (a geodesic, so gently curved over long distances). */
const LINE_STEPS = 48;
/** Points on a drawn error ellipse. */
const ELLIPSE_POINTS = 72;

/** Every bearing as a line (active, outlier or excluded) plus its observer dot. */
export function BearingLayers({ bearings, outlierIds, fix }: { bearings: BearingView[]; outlierIds: Set<string>; fix: LatLon | null }) {
  return (
    <>
      {bearings.map((b) => {
        const kind = b.excluded ? 'excluded' : outlierIds.has(b.id) ? 'outlier' : 'bearing';
        const line = { lat: b.lat, lon: b.lon, azimuthDeg: b.azimuthTrueDeg, oneWay: b.oneWay };
        const positions = geodesicLine(line, bearingDrawLengthM(b, fix), LINE_STEPS);
        // Leaflet sets className only when a path is created: the key re-creates the line when its kind changes.
        return (
          <Polyline
            key={`${b.id}-${kind}-${b.version}`}
            positions={positions}
            className={`qf-bearing qf-bearing-${kind === 'bearing' ? 'active' : kind}`}
            pathOptions={LINE_STYLES[kind]}
            interactive={false}
          />
        );
      })}
      {bearings.map((b) => (
        <Marker key={`${b.id}-obs-${b.excluded}-${outlierIds.has(b.id)}`} position={[b.lat, b.lon]} icon={observerIcon(outlierIds.has(b.id), b.excluded)} keyboard={false}>
          <Tooltip>
            {b.azimuthTrueDeg.toFixed(1)}° true ±{b.sigmaDeg.toFixed(1)}°{b.oneWay ? ', one-way' : ''}
            {b.author?.callSign ? ` · ${b.author.callSign}` : ''}
            {b.excluded ? ' · excluded' : outlierIds.has(b.id) ? ' · outlier' : ''}
          </Tooltip>
        </Marker>
      ))}
    </>
  );
}

/** An error ellipse as a polygon (closed ring) around its centre. */
function EllipseShape({ center, ellipse, alternative }: { center: LatLon; ellipse: Ellipse; alternative: boolean }) {
  const ring = useMemo(() => ellipsePolygon(center, ellipse, ELLIPSE_POINTS), [center, ellipse]);
  return (
    <Polygon
      positions={ring}
      className={alternative ? 'qf-ellipse-alt' : 'qf-ellipse'}
      pathOptions={LINE_STYLES[alternative ? 'ellipseAlt' : 'ellipse']}
      interactive={false}
    />
  );
}

/** The likelihood-ratio region of a fix in poor geometry ([lon, lat] ring from lib/df), drawn like the ellipse. */
function RegionShape({ ring }: { ring: [number, number][] }) {
  const positions = useMemo(() => ring.map(([lon, lat]) => [lat, lon] as [number, number]), [ring]);
  return <Polygon positions={positions} className="qf-ellipse qf-region" pathOptions={LINE_STYLES.ellipse} interactive={false} />;
}

/** Pairwise crossings, the fix with its 95 % ellipse (or region), and the all-lines alternative. */
export function FixLayers({ fix }: { fix: FixView }) {
  const f = fix.current?.fix;
  if (!f || !f.ok) return null;
  const semi = formatApproxMetres(f.ellipse.semiMajorM);
  return (
    <>
      {f.intersections.map((x, i) => (
        <Marker key={`x${i}-${x.ids.join('-')}`} position={[x.lat, x.lon]} icon={crossIcon} interactive={false} keyboard={false} />
      ))}
      {f.allLines && (
        <>
          <EllipseShape center={f.allLines} ellipse={f.allLines.ellipse} alternative />
          <Marker position={[f.allLines.lat, f.allLines.lon]} icon={fixIcon(true)} keyboard={false} title={`Fix with every line, ellipse ${formatApproxMetres(f.allLines.ellipse.semiMajorM)}`} />
        </>
      )}
      {f.region ? <RegionShape ring={f.region} /> : <EllipseShape center={f} ellipse={f.ellipse} alternative={false} />}
      {/* above the next-spot targets (zIndexOffset 1000), so they never cover the fix */}
      <Marker position={[f.lat, f.lon]} icon={fixIcon(false)} keyboard={false} zIndexOffset={2000} title={`Fix: 95 % ellipse semi-major ${semi}`} />
    </>
  );
}

/** How the fix converged: a thin line through earlier estimates, ending at the current fix. */
export function TrailLayer({ fix }: { fix: FixView }) {
  const points = fix.trail.filter((t) => t.ok && t.lat !== null && t.lon !== null).map((t) => [t.lat as number, t.lon as number] as [number, number]);
  const f = fix.current?.fix;
  const line = f && f.ok ? [...points, [f.lat, f.lon] as [number, number]] : points;
  if (points.length === 0) return null;
  return (
    <>
      {line.length > 1 && <Polyline positions={line} className="qf-trail" pathOptions={LINE_STYLES.trail} interactive={false} />}
      {points.map((p, i) => (
        <CircleMarker key={`t${i}`} center={p} radius={3} className="qf-trail-dot" pathOptions={{ ...LINE_STYLES.trail, fillColor: '#fff', fillOpacity: 1 }} interactive={false} />
      ))}
    </>
  );
}

/** Suggested next spots as large targets, reachable with Tab and chosen with a tap, Enter or Space. */
export function SpotMarkers({ spots, onSelect }: { spots: NextSpot[]; onSelect?: (s: NextSpot) => void }) {
  return (
    <>
      {spots.map((s, i) => {
        const label = formatApproxMetres(s.expectedSemiMajorM);
        const handlers = {
          click: () => onSelect?.(s),
          keydown: (e: LeafletKeyboardEvent) => {
            if (e.originalEvent.key === 'Enter' || e.originalEvent.key === ' ') {
              e.originalEvent.preventDefault();
              onSelect?.(s);
            }
          },
        };
        return (
          <Marker
            key={`s${i}-${s.lat}-${s.lon}`}
            position={[s.lat, s.lon]}
            icon={spotIcon(label)}
            keyboard
            title={`Next spot ${i + 1}: ellipse expected ${label} after a bearing here`}
            eventHandlers={handlers}
            zIndexOffset={1000}
          />
        );
      })}
    </>
  );
}

/** The reporter's home position: a neutral symbol, never a house, labelled as private. */
export function ReporterMarker({ position }: { position: LatLon }) {
  const icon = useMemo(() => labelledPointIcon('reporter', 'reporter (private)'), []);
  return <Marker position={[position.lat, position.lon]} icon={icon} keyboard={false} interactive={false} />;
}
