import type { Knex } from 'knex';
import type { Geometry } from 'geojson';
import { db } from './index';
import type { WhiteningAffine } from '@/lib/df';

export type PlaceKind = 'building' | 'street';

/** One street or building as the importer hands it over; `source` + `sourceId` is the re-import key. */
export type PlaceInput = {
  source: string;
  sourceId: string;
  kind: PlaceKind;
  name?: string | null;
  housenumber?: string | null;
  street?: string | null;
  postcode?: string | null;
  city?: string | null;
  geometry: Geometry;
};

export type PlaceFeature = {
  type: 'Feature';
  id: string;
  geometry: Geometry;
  properties: { kind: PlaceKind; name: string | null; housenumber: string | null; street: string | null; postcode: string | null; address: string | null };
};

/** "12 Quill Row, QH1 2AB Quillon": the parts that are known, in letter order. */
export function placeAddress(p: Pick<PlaceInput, 'housenumber' | 'street' | 'postcode' | 'city' | 'name'>): string | null {
  const line1 = [p.housenumber, p.street].filter(Boolean).join(' ') || p.name || '';
  const line2 = [p.postcode, p.city].filter(Boolean).join(' ');
  return [line1, line2].filter(Boolean).join(', ') || null;
}

const CHUNK = 500;
const MERGED = ['kind', 'name', 'housenumber', 'street', 'postcode', 'city', 'geom'] as const;

/**
 * Inserts or updates places by their source key, in the caller's transaction.
 * @returns how many rows were new and how many were updated
 */
export async function upsertPlaces(trx: Knex.Transaction, places: PlaceInput[]): Promise<{ inserted: number; updated: number }> {
  let inserted = 0;
  let updated = 0;
  for (let i = 0; i < places.length; i += CHUNK) {
    const rows = places.slice(i, i + CHUNK).map((p) => ({
      source: p.source,
      source_id: p.sourceId,
      kind: p.kind,
      name: p.name ?? null,
      housenumber: p.housenumber ?? null,
      street: p.street ?? null,
      postcode: p.postcode ?? null,
      city: p.city ?? null,
      // RFC 7946 positions may carry an altitude: the map and the region are flat, so it is dropped.
      geom: trx.raw('ST_Force2D(ST_SetSRID(ST_GeomFromGeoJSON(?), 4326))', [JSON.stringify(p.geometry)]),
    }));
    const out: { inserted: boolean }[] = await trx('places')
      .insert(rows)
      .onConflict(['source', 'source_id'])
      .merge({ ...Object.fromEntries(MERGED.map((c) => [c, trx.raw(`excluded.${c}`)])), updated_at: trx.fn.now() })
      .returning(trx.raw('(xmax = 0) as inserted') as never);
    for (const r of out) (r.inserted ? inserted++ : updated++);
  }
  return { inserted, updated };
}

/** Source ids among `sourceIds` whose geometry PostGIS finds invalid, with the reason (e.g. a self-intersection). */
export async function invalidPlaces(trx: Knex.Transaction, source: string, sourceIds: string[]): Promise<{ sourceId: string; reason: string }[]> {
  const { rows } = await trx.raw<{ rows: { sourceId: string; reason: string }[] }>(
    `select source_id as "sourceId", ST_IsValidReason(geom) as reason from places
      where source = ? and source_id = any(?::text[]) and not ST_IsValid(geom) order by source_id`,
    [source, sourceIds],
  );
  return rows;
}

/** Counts per kind, optionally for one source (for reports and tests). */
export async function countPlaces(source?: string, q: Knex = db): Promise<{ buildings: number; streets: number; numbered: number }> {
  const { rows } = await q.raw<{ rows: { buildings: number; streets: number; numbered: number }[] }>(
    `select count(*) filter (where kind = 'building')::int as buildings, count(*) filter (where kind = 'street')::int as streets,
            count(*) filter (where kind = 'building' and housenumber is not null)::int as numbered
       from places where (?::text is null or source = ?)`,
    [source ?? null, source ?? null],
  );
  return rows[0];
}

/**
 * Streets and buildings whose geometry meets the box (WGS84 degrees), streets first, at most `limit`.
 * @returns the features, whether more were there than the limit, and whether any of them came
 *   from OpenStreetMap (an OSM export, or a GeoJSON file with OSM ids), whose licence asks for attribution
 */
export async function placesInBox(
  box: { west: number; south: number; east: number; north: number },
  limit: number,
  q: Knex = db,
): Promise<{ features: PlaceFeature[]; truncated: boolean; fromOsm: boolean }> {
  const { rows } = await q.raw<{ rows: (Omit<PlaceFeature['properties'], 'address'> & { id: string; city: string | null; geometry: Geometry; osm: boolean })[] }>(
    `select id, kind, name, housenumber, street, postcode, city, ST_AsGeoJSON(geom, 7)::json as geometry,
            (source = 'osm' or source_id ~ '^(node|way|relation)/[0-9]+$') as osm
       from places
      where geom && ST_MakeEnvelope(?, ?, ?, ?, 4326)
      order by kind = 'building', id
      limit ?`,
    [box.west, box.south, box.east, box.north, limit + 1],
  );
  const features = rows.slice(0, limit).map((r): PlaceFeature => ({
    type: 'Feature',
    id: r.id,
    geometry: r.geometry,
    properties: { kind: r.kind, name: r.name, housenumber: r.housenumber, street: r.street, postcode: r.postcode, address: r.kind === 'building' ? placeAddress(r) : null },
  }));
  return { features, truncated: rows.length > limit, fromOsm: rows.slice(0, limit).some((r) => r.osm) };
}

export async function getPlace(id: string, q: Knex = db): Promise<{ id: string; kind: PlaceKind; address: string | null; lat: number; lon: number } | undefined> {
  const { rows } = await q.raw(
    `select id, kind, name, housenumber, street, postcode, city, ST_Y(ST_PointOnSurface(geom)) as lat, ST_X(ST_PointOnSurface(geom)) as lon
       from places where id = ?`,
    [id],
  );
  const r = rows[0];
  return r && { id: r.id, kind: r.kind, address: placeAddress(r), lat: r.lat, lon: r.lon };
}

export type CandidateRow = { placeId: string; address: string | null; lat: number; lon: number; insideRegion: boolean; mahalanobis: number };

/**
 * Buildings meeting the region (a GeoJSON polygon) or within `marginM` metres of it, ordered by
 * the Mahalanobis distance of the footprint's nearest point (0 when the footprint holds the
 * centre), then of its centroid; at most `limit`.
 * @returns those rows, and how many buildings meet the region in all (the limit aside)
 */
export async function buildingsNearRegion(
  region: Geometry,
  whitening: WhiteningAffine,
  opts: { marginM: number; limit: number },
  q: Knex = db,
): Promise<{ rows: CandidateRow[]; insideTotal: number }> {
  const w = whitening;
  const aff = 'ST_Affine(p.geom, ?, ?, ?, ?, ?, ?)';
  const affArgs = [w.a, w.b, w.d, w.e, w.xoff, w.yoff];
  const { rows } = await q.raw(
    `with region as (select ST_SetSRID(ST_GeomFromGeoJSON(?), 4326) as g)
     select p.id, p.name, p.housenumber, p.street, p.postcode, p.city,
            ST_Y(ST_PointOnSurface(p.geom)) as lat, ST_X(ST_PointOnSurface(p.geom)) as lon,
            ST_Intersects(p.geom, r.g) as inside,
            ST_Distance(${aff}, ST_SetSRID(ST_MakePoint(0, 0), 4326)) as m_near,
            ST_Distance(ST_Centroid(${aff}), ST_SetSRID(ST_MakePoint(0, 0), 4326)) as m_centroid,
            (count(*) filter (where ST_Intersects(p.geom, r.g)) over ())::int as inside_total
       from places p, region r
      where p.kind = 'building' and ST_DWithin(geography(p.geom), geography(r.g), ?)
      order by m_near, m_centroid, p.id
      limit ?`,
    [JSON.stringify(region), ...affArgs, ...affArgs, opts.marginM, opts.limit],
  );
  const out = rows.map((r: Record<string, never>) => ({
    placeId: r.id,
    address: placeAddress(r),
    lat: r.lat,
    lon: r.lon,
    insideRegion: r.inside,
    mahalanobis: r.m_near,
  }));
  return { rows: out, insideTotal: rows[0]?.inside_total ?? 0 };
}
