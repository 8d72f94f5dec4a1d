import { z } from 'zod';
import { safeText } from './text';

/** Largest box /api/places answers, in degrees of latitude and longitude (about 5.5 km north-south). */
export const PLACES_MAX_BOX_DEG = 0.05;
/** Most features one /api/places answer carries. */
export const PLACES_CAP = 1500;

const deg = (min: number, max: number) => z.number().min(min).max(max);

/** `bbox=west,south,east,north` in WGS84 degrees (the RFC 7946 order). */
export const placesQuerySchema = z.object({
  bbox: safeText()
    .max(200)
    .transform((s, ctx) => {
      const parts = s.split(',').map((p) => Number(p.trim()));
      const parsed = z.tuple([deg(-180, 180), deg(-90, 90), deg(-180, 180), deg(-90, 90)]).safeParse(parts);
      if (!parsed.success || parts.length !== 4) {
        ctx.addIssue({ code: 'custom', message: 'bbox must be four numbers: west,south,east,north in degrees.' });
        return z.NEVER;
      }
      const [west, south, east, north] = parsed.data;
      if (west >= east || south >= north) {
        ctx.addIssue({ code: 'custom', message: 'bbox must have west < east and south < north.' });
        return z.NEVER;
      }
      if (east - west > PLACES_MAX_BOX_DEG || north - south > PLACES_MAX_BOX_DEG) {
        ctx.addIssue({ code: 'custom', message: `bbox is too large: at most ${PLACES_MAX_BOX_DEG}° a side (zoom in to street level).` });
        return z.NEVER;
      }
      return { west, south, east, north };
    }),
});

export const PREMISES_HOW = ['level-peak', 'switch-off-test', 'other'] as const;

/** A hunter confirming the premises: a building from the places layer, or a point and an address. */
export const premisesSchema = z
  .object({
    placeId: z.uuid('Not a place id.').optional(),
    address: safeText().trim().max(300).optional(),
    lat: z.number().min(-90).max(90).optional(),
    lon: z.number().min(-180).max(180).optional(),
    how: z.enum(PREMISES_HOW, 'Say how the premises were confirmed.'),
    note: safeText().trim().max(1000).default(''),
  })
  .superRefine((v, ctx) => {
    if (v.placeId) return;
    if (!v.address || v.address.length < 5) ctx.addIssue({ code: 'custom', path: ['address'], message: 'Give the address (or pick the building on the map).' });
    if (v.lat === undefined || v.lon === undefined) ctx.addIssue({ code: 'custom', path: ['lat'], message: 'Place a point on the map (or pick the building).' });
  });
export type PremisesInput = z.input<typeof premisesSchema>;
