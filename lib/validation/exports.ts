import { z } from 'zod';

export const EXPORT_FORMATS = ['geojson', 'kml', 'csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/**
 * `?format=` (GeoJSON by default) and `?what=` (which table a CSV holds; the first one named is
 * the default). A table other than the default is CSV only.
 */
export function exportParamsSchema<const W extends readonly [string, ...string[]]>(whats: W) {
  return z
    .object({ format: z.enum(EXPORT_FORMATS).default('geojson'), what: z.enum(whats).default(whats[0] as W[0]) })
    .refine((p) => p.what === whats[0] || p.format === 'csv', { path: ['what'], message: `what=${whats.slice(1).join('|')} is a CSV export: add format=csv.` });
}
