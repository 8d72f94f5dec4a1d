declare module 'tokml' {
  import type { FeatureCollection } from 'geojson';
  /** GeoJSON to KML 2.2 text. */
  export default function tokml(geojson: FeatureCollection, options?: { name?: string; description?: string; documentName?: string; documentDescription?: string; simplestyle?: boolean; timestamp?: string }): string;
}
