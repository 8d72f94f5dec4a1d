import { z } from 'zod';

/** One level-log reading: `POST /api/cases/:id/levels`. S-units 0–9 (fractions allowed), S9+N as overS9Db. */
export const levelReadingSchema = z
  .object({
    clientId: z.uuid('clientId must be a UUID made on the device.').optional(),
    frequencyKhz: z.number().min(10, 'From 10 kHz.').max(3_000_000, 'Up to 3 GHz.'),
    level: z.discriminatedUnion('unit', [
      z.object({ unit: z.literal('S'), value: z.number().min(0, 'S-units run from 0…').max(9, '…to 9; above S9 give overS9Db.'), overS9Db: z.number().min(0).max(80).optional() }),
      z.object({ unit: z.literal('dBm'), value: z.number().min(-170, 'Below -170 dBm is not a receiver reading.').max(20, 'Above +20 dBm is not a receiver reading.') }),
    ]),
    bandwidthHz: z.number().min(10, 'From 10 Hz.').max(1_000_000, 'Up to 1 MHz.'),
    takenAt: z.iso.datetime({ offset: true, message: 'takenAt is an ISO 8601 time with its zone.' }),
    lat: z.number().min(-90).max(90).optional(),
    lon: z.number().min(-180).max(180).optional(),
    phase: z.enum(['before', 'after'], 'phase is before or after (the fix).'),
  })
  .refine((r) => (r.lat === undefined) === (r.lon === undefined), { message: 'Give both lat and lon, or neither.', path: ['lon'] })
  .refine((r) => new Date(r.takenAt).getTime() <= Date.now() + 5 * 60_000, { message: 'takenAt is in the future.', path: ['takenAt'] });
