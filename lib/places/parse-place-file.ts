import { createHash } from 'node:crypto';
import { DOMParser } from '@xmldom/xmldom';
import osmtogeojson from 'osmtogeojson';
import type { Geometry, Position } from 'geojson';
import type { PlaceInput, PlaceKind } from '@/db/places';

/** A place file Quietfix cannot use; the message names the line or feature at fault. */
export class PlaceFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PlaceFileError';
  }
}

export type ParsedPlaces = { places: PlaceInput[]; skipped: number; labels: Map<string, string> };

const OSM_ID = /^(node|way|relation)\/\d+$/;

/** The line (1-based) and column of a character offset in `text`. */
function lineOf(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - before.lastIndexOf('\n') };
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Checks one [lon, lat] position; returns a problem or null. */
function positionProblem(p: unknown): string | null {
  if (!Array.isArray(p) || p.length < 2 || !p.every((x) => typeof x === 'number' && Number.isFinite(x))) return 'a position is not [longitude, latitude] numbers';
  const [lon, lat] = p as number[];
  if (lon < -180 || lon > 180 || lat < -90 || lat > 90) return `position [${lon}, ${lat}] is outside longitude -180..180 / latitude -90..90 (RFC 7946 order is longitude first)`;
  return null;
}

function lineProblem(line: unknown, what: string): string | null {
  if (!Array.isArray(line) || line.length < 2) return `${what} needs at least 2 positions`;
  for (const p of line) {
    const bad = positionProblem(p);
    if (bad) return `${what}: ${bad}`;
  }
  return null;
}

function ringProblem(ring: unknown, what: string): string | null {
  if (!Array.isArray(ring) || ring.length < 4) return `${what} needs at least 4 positions (closed)`;
  const bad = lineProblem(ring, what);
  if (bad) return bad;
  const [a, z] = [ring[0] as Position, ring[ring.length - 1] as Position];
  if (a[0] !== z[0] || a[1] !== z[1]) return `${what} is not closed (the last position must repeat the first)`;
  return null;
}

/** What is wrong with a building or street geometry, or null. */
function geometryProblem(g: Geometry): string | null {
  const c = (g as { coordinates?: unknown }).coordinates;
  switch (g.type) {
    case 'LineString':
      return lineProblem(c, 'the line');
    case 'MultiLineString':
      if (!Array.isArray(c) || c.length === 0) return 'the lines are empty';
      for (const [i, l] of c.entries()) { const b = lineProblem(l, `line ${i + 1}`); if (b) return b; }
      return null;
    case 'Polygon':
      if (!Array.isArray(c) || c.length === 0) return 'the polygon has no ring';
      for (const [i, r] of c.entries()) { const b = ringProblem(r, `ring ${i + 1}`); if (b) return b; }
      return null;
    case 'MultiPolygon':
      if (!Array.isArray(c) || c.length === 0) return 'the polygons are empty';
      for (const [j, poly] of c.entries()) {
        if (!Array.isArray(poly) || poly.length === 0) return `polygon ${j + 1} has no ring`;
        for (const [i, r] of poly.entries()) { const b = ringProblem(r, `polygon ${j + 1} ring ${i + 1}`); if (b) return b; }
      }
      return null;
    default:
      return null;
  }
}

const AREA = new Set(['Polygon', 'MultiPolygon']);
const LINE = new Set(['LineString', 'MultiLineString']);

/** building / street from the tags (OSM keys or our own `kind`), checked against the geometry type. */
function kindOf(tags: Record<string, unknown>, g: Geometry): PlaceKind | null {
  const declared = tags.kind === 'building' || tags.kind === 'street' ? tags.kind : tags.building ? 'building' : tags.highway ? 'street' : null;
  if (declared === 'building' && AREA.has(g.type)) return 'building';
  if (declared === 'street' && LINE.has(g.type)) return 'street';
  return null;
}

const text = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? v.trim().slice(0, 200) : typeof v === 'number' ? String(v) : null);

function toPlace(source: string, sourceId: string, kind: PlaceKind, tags: Record<string, unknown>, geometry: Geometry): PlaceInput {
  return {
    source,
    sourceId,
    kind,
    name: text(tags.name),
    housenumber: kind === 'building' ? text(tags['addr:housenumber'] ?? tags.housenumber) : null,
    street: kind === 'building' ? text(tags['addr:street'] ?? tags.street) : null,
    postcode: kind === 'building' ? text(tags['addr:postcode'] ?? tags.postcode) : null,
    city: kind === 'building' ? text(tags['addr:city'] ?? tags.city) : null,
    geometry,
  };
}

/**
 * A GeoJSON (RFC 7946) FeatureCollection or Feature -> places. Polygons tagged as buildings
 * (`building=*` or `kind: "building"`) and lines tagged as streets (`highway=*` or `kind: "street"`)
 * are kept; other features are counted as skipped. Ids: the feature's `id` (or `@id` / `id`
 * property), else a hash of its geometry, so a re-import finds the same rows.
 */
export function parseGeoJsonPlaces(raw: string, source?: string): ParsedPlaces {
  let doc: unknown;
  try {
    doc = JSON.parse(raw);
  } catch (err) {
    const m = /position (\d+)/.exec((err as Error).message);
    const where = m ? lineOf(raw, Number(m[1])) : null;
    throw new PlaceFileError(`The file is not valid JSON${where ? ` (line ${where.line}, column ${where.column})` : ''}: ${(err as Error).message}`);
  }
  const features = isObject(doc) && doc.type === 'FeatureCollection' ? doc.features : isObject(doc) && doc.type === 'Feature' ? [doc] : null;
  if (!Array.isArray(features)) throw new PlaceFileError('The file is JSON but not a GeoJSON FeatureCollection or Feature (its "type" must be one of those).');
  const places: PlaceInput[] = [];
  const labels = new Map<string, string>();
  let skipped = 0;
  for (const [i, f] of features.entries()) {
    const label = `feature ${i + 1}${isObject(f) && f.id !== undefined ? ` (id ${JSON.stringify(f.id)})` : ''}`;
    if (!isObject(f) || f.type !== 'Feature') throw new PlaceFileError(`${label}: not a GeoJSON Feature.`);
    if (f.properties !== null && f.properties !== undefined && !isObject(f.properties)) throw new PlaceFileError(`${label}: "properties" must be an object or null.`);
    const props = (f.properties ?? {}) as Record<string, unknown>;
    const tags = isObject(props.tags) ? { ...props, ...props.tags } : props;
    const g = f.geometry as Geometry | null;
    if (g !== null && (!isObject(g) || typeof g.type !== 'string')) throw new PlaceFileError(`${label}: "geometry" must be a GeoJSON geometry or null.`);
    const problem = g && geometryProblem(g);
    if (problem) throw new PlaceFileError(`${label}: ${problem}.`);
    const kind = g && kindOf(tags, g);
    if (!g || !kind) { skipped++; continue; }
    const givenId = f.id ?? props['@id'] ?? props.id;
    const sourceId = givenId !== undefined && givenId !== null && String(givenId) !== '' ? String(givenId) : `sha1:${createHash('sha1').update(JSON.stringify(g)).digest('hex')}`;
    const src = source ?? (OSM_ID.test(sourceId) ? 'osm' : 'geojson');
    const key = `${src} ${sourceId}`;
    if (labels.has(key)) throw new PlaceFileError(`${label}: the same id as ${labels.get(key)}; each feature needs its own id.`);
    labels.set(key, label);
    places.push(toPlace(src, sourceId, kind, tags, g));
  }
  return { places, skipped, labels };
}

/**
 * An OpenStreetMap XML export (.osm) -> places, through osmtogeojson. A syntax error names its
 * line and column; a way that refers to a node missing from the file names the way and its line.
 */
export function parseOsmXmlPlaces(raw: string): ParsedPlaces {
  let fatal: string | null = null;
  let doc: Document;
  try {
    const parser = new DOMParser({
      onError: (level, message) => {
        if (level === 'fatalError' && !fatal) fatal = message;
      },
    });
    doc = parser.parseFromString(raw, 'text/xml') as unknown as Document;
  } catch (err) {
    const loc = (err as { locator?: { lineNumber?: number; columnNumber?: number } }).locator;
    throw new PlaceFileError(`The file is not valid XML${loc?.lineNumber ? ` (line ${loc.lineNumber}, column ${loc.columnNumber})` : ''}: ${fatal ?? (err as Error).message}`);
  }
  const root = doc.documentElement;
  if (!root || root.nodeName !== 'osm') throw new PlaceFileError(`The file is XML but not an OpenStreetMap export: its root element is <${root?.nodeName ?? 'nothing'}>, not <osm>.`);
  const line = (el: Element) => (el as unknown as { lineNumber?: number }).lineNumber;
  const nodeIds = new Set<string>();
  const nodes = root.getElementsByTagName('node');
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i];
    const [lat, lon] = [Number(n.getAttribute('lat')), Number(n.getAttribute('lon'))];
    if (!n.getAttribute('id') || !Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180)
      throw new PlaceFileError(`line ${line(n)}: node ${n.getAttribute('id') ?? '(no id)'} needs an id and lat/lon in degrees.`);
    nodeIds.add(n.getAttribute('id')!);
  }
  const ways = root.getElementsByTagName('way');
  for (let i = 0; i < ways.length; i++) {
    const w = ways[i];
    const nds = w.getElementsByTagName('nd');
    for (let j = 0; j < nds.length; j++) {
      const ref = nds[j].getAttribute('ref') ?? '';
      if (!nodeIds.has(ref)) throw new PlaceFileError(`line ${line(nds[j])}: way ${w.getAttribute('id')} refers to node ${ref}, which is not in the file (export the area with its nodes).`);
    }
  }
  const fc = osmtogeojson(doc);
  const places: PlaceInput[] = [];
  const labels = new Map<string, string>();
  let skipped = 0;
  for (const f of fc.features) {
    const id = String(f.id);
    const kind = kindOf(f.properties?.tags ?? {}, f.geometry);
    if (!kind) { skipped++; continue; }
    labels.set(`osm ${id}`, id);
    places.push(toPlace('osm', id, kind, f.properties?.tags ?? {}, f.geometry));
  }
  return { places, skipped, labels };
}

/** Picks the parser by the file's name (.osm / .xml) or its first character. */
export function parsePlaceFile(name: string, raw: string, source?: string): ParsedPlaces {
  const xml = /\.(osm|xml)$/i.test(name) || raw.trimStart().startsWith('<');
  return xml ? parseOsmXmlPlaces(raw) : parseGeoJsonPlaces(raw, source);
}
