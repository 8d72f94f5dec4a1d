/** Declarations for the part of osmtogeojson 2.2 used by lib/places (it ships no types). */
declare module 'osmtogeojson' {
  import type { FeatureCollection, Geometry } from 'geojson';
  type OsmProperties = { type: string; id: number; tags?: Record<string, string>; relations?: unknown[]; meta?: Record<string, unknown> };
  export default function osmtogeojson(data: unknown, options?: { flatProperties?: boolean }): FeatureCollection<Geometry, OsmProperties>;
}
