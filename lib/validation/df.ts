import { z } from 'zod';

/** One line of bearing as the API accepts it (see lib/df LineOfBearing). */
export const lineOfBearingSchema = z.object({
  id: z.string().max(64).optional(),
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-540).max(540),
  azimuthDeg: z.number().finite(),
  sigmaDeg: z.number().gt(0).max(45).optional(),
  oneWay: z.boolean().optional(),
});

export const fixRequestSchema = z.object({
  lines: z.array(lineOfBearingSchema).min(1).max(2000),
  confidence: z.number().gt(0).lt(1).optional(),
});
