import { z } from 'zod';
import { safeText } from './text';

/** Longitude accepted from -540 to 540 degrees and normalised to [-180, 180). */
const longitude = z
  .number()
  .finite()
  .min(-540)
  .max(540)
  .transform((lon) => {
    if (lon >= -180 && lon < 180) return lon;
    const v = (((lon + 180) % 360) + 360) % 360 - 180;
    return v === 0 ? 0 : v;
  });

/** One line of bearing as the API accepts it (see lib/df LineOfBearing). */
export const lineOfBearingSchema = z.object({
  id: safeText().max(64).optional(),
  lat: z.number().finite().min(-90).max(90),
  lon: longitude,
  /** degrees clockwise from true north; any finite number */
  azimuthDeg: z.number().finite(),
  /** 1-sigma bearing error, degrees */
  sigmaDeg: z.number().finite().positive().max(45).optional(),
  oneWay: z.boolean().optional(),
});

/** Body of POST /api/df/fix. */
export const fixRequestSchema = z.object({
  lines: z.array(lineOfBearingSchema).min(1).max(2000),
  confidence: z.number().gt(0).lt(1).optional(),
});

export type LineOfBearingInput = z.input<typeof lineOfBearingSchema>;
export type FixRequest = z.output<typeof fixRequestSchema>;
