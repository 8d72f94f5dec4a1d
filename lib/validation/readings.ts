import { z } from 'zod';
import { clientIdSchema } from './client-id';
import { safeText } from './text';

export const LEVEL_UNITS = ['S', 'dBm'] as const;
export type LevelUnit = (typeof LEVEL_UNITS)[number];

/** Highest S value accepted: S9+60 dB read on the same 6 dB scale (9 + 60 / 6). */
export const MAX_S_VALUE = 19;

/** A level as read from the receiver: S-units (past S9 at 6 dB each, IARU Region 1) or dBm. */
export const levelSchema = z
  .object({ unit: z.enum(LEVEL_UNITS), value: z.number().min(-200).max(100) })
  .refine((l) => l.unit !== 'S' || (l.value >= 0 && l.value <= MAX_S_VALUE), {
    message: `An S-meter reading is between S0 and S9+60 dB (0 to ${MAX_S_VALUE}).`,
    path: ['value'],
  });

/** One level reading taken on the walk: where (the phone's position and its accuracy), how loud, at what frequency, when. */
export const readingInputSchema = z.object({
  clientId: clientIdSchema,
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
  accuracyM: z.number().min(0).max(100_000).nullable().optional(),
  level: levelSchema,
  frequencyKhz: z.number().positive().max(3_000_000).nullable().optional(),
  takenAt: z.iso.datetime({ offset: true }),
  note: safeText().trim().max(500).default(''),
});
export type ReadingInput = z.input<typeof readingInputSchema>;
