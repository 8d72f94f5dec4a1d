import { rewind } from '@turf/turf';
import type { Feature, FeatureCollection, Geometry, Polygon } from 'geojson';
import { geodesicLine, type Fix } from '@/lib/df';
import { fixRegion } from '@/lib/hunt/candidates';

/** Positions to 7 decimals (about 1 cm), longitude first as RFC 7946 §3.1.1 orders them. */
const pos = (lat: number, lon: number): [number, number] => [Math.round(lon * 1e7) / 1e7, Math.round(lat * 1e7) / 1e7];

export type ExportCase = { id: string; reference: string; title: string; status: string; bands: string[]; createdAt: Date | string; outcome: string | null; levelBeforeDbm: number | null; levelAfterDbm: number | null };
export type ExportBearing = { id: string; lat: number; lon: number; azimuthEnteredDeg: number; reference: string; azimuthTrueDeg: number; sigmaDeg: number; frequencyKhz: number | null; oneWay: boolean; excluded: boolean; takenAt: Date | string; note: string; authorName?: string | null };

/** How far each line is drawn each way: beyond the fix, else 3 km (common practice, no source). */
function lineLengthM(b: ExportBearing, fix: Fix | undefined): number {
  if (!fix?.ok) return 3000;
  const dLat = (fix.lat - b.lat) * 111_320;
  const dLon = (fix.lon - b.lon) * 111_320 * Math.cos((b.lat * Math.PI) / 180);
  return Math.max(500, 1.5 * Math.hypot(dLat, dLon));
}

/**
 * One case as GeoJSON (RFC 7946): every bearing as a geodesic LineString, the fix as a Point, its
 * 95 % region as a Polygon wound by the right-hand rule (exterior counter-clockwise, §3.1.6).
 * The reporter's home position is never part of an export.
 */
export function caseGeoJson(c: ExportCase, bearings: ExportBearing[], fix: Fix | undefined): FeatureCollection {
  const common = { caseId: c.id, reference: c.reference };
  const features: Feature<Geometry>[] = bearings.map((b) => ({
    type: 'Feature',
    id: b.id,
    geometry: {
      type: 'LineString',
      coordinates: geodesicLine({ lat: b.lat, lon: b.lon, azimuthDeg: b.azimuthTrueDeg, oneWay: b.oneWay }, lineLengthM(b, fix), 32).map(([lat, lon]) => pos(lat, lon)),
    },
    properties: {
      ...common,
      kind: 'bearing',
      name: `${c.reference} bearing ${Math.round(b.azimuthTrueDeg)}°`,
      observer: pos(b.lat, b.lon),
      azimuthTrueDeg: b.azimuthTrueDeg,
      azimuthEnteredDeg: b.azimuthEnteredDeg,
      reference: b.reference,
      sigmaDeg: b.sigmaDeg,
      frequencyKhz: b.frequencyKhz,
      oneWay: b.oneWay,
      excluded: b.excluded,
      takenAt: new Date(b.takenAt).toISOString(),
      note: b.note,
    },
  }));
  if (fix?.ok) {
    features.push({
      type: 'Feature',
      id: `${c.id}-fix`,
      geometry: { type: 'Point', coordinates: pos(fix.lat, fix.lon) },
      properties: { ...common, kind: 'fix', name: `${c.reference} fix`, title: c.title, status: c.status, semiMajorM: fix.ellipse.semiMajorM, semiMinorM: fix.ellipse.semiMinorM, majorAxisAzimuthDeg: fix.ellipse.majorAxisAzimuthDeg, lineCount: bearings.filter((b) => !b.excluded).length },
    });
    const region = rewind(fixRegion(fix), { reverse: false }) as Polygon;
    region.coordinates = region.coordinates.map((ring) => ring.map(([lon, lat]) => pos(lat, lon)));
    features.push({ type: 'Feature', id: `${c.id}-region`, geometry: region, properties: { ...common, kind: 'region', name: `${c.reference} 95 % region` } });
  }
  return { type: 'FeatureCollection', features };
}
