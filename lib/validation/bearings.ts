import { z } from 'zod';
import { safeText } from './text';
import { clientIdSchema } from './client-id';

export const NULL_QUALITY = ['sharp', 'fair', 'broad'] as const;

/** What a bearing records, without defaults: the patch schema makes every field optional. */
const fields = z.object({
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
  positionSource: z.enum(['device', 'map']),
  positionAccuracyM: z.number().min(0).max(100_000).optional(),
  reference: z.enum(['true', 'magnetic']),
  frequencyKhz: z.number().positive().max(3_000_000).optional(),
  oneWay: z.boolean(),
  note: safeText().trim().max(1000),
  takenAt: z.iso.datetime({ offset: true }).optional(),
});

/** The reading itself: azimuth and what its 1-sigma comes from. */
const reading = {
  azimuthDeg: z.number().min(-360).max(720),
  sigmaDeg: z.number().min(0.1).max(45).optional(),
  nullWidthDeg: z.number().min(0.2).max(90).optional(),
  quality: z.enum(NULL_QUALITY).optional(),
};

/** A new bearing or sweep: the defaults live here only (an edit changes only what it names). */
const base = fields.extend({
  /** A UUID the phone makes when the bearing is typed: a repeat with the same id stores nothing new. */
  clientId: clientIdSchema.optional(),
  /** The hunter accepts a device position worse than the club's limit. */
  accuracyConfirmed: z.boolean().default(false),
  oneWay: fields.shape.oneWay.default(false),
  note: fields.shape.note.default(''),
});

/**
 * A bearing as typed or read from the compass. Its 1-sigma comes from sigmaDeg, else from the
 * null width (half the width over which the level stays within a few dB of the null), else
 * from the sharp/fair/broad choice.
 */
export const bearingInputSchema = base.extend(reading);
export type BearingInput = z.input<typeof bearingInputSchema>;

/** An edit: only the fields it names change (no defaults), plus the version it was loaded at. */
export const bearingPatchSchema = fields
  .extend(reading)
  .partial()
  .extend({ version: z.number().int().min(1), excluded: z.boolean().optional(), accuracyConfirmed: z.boolean().optional() });

/** A rotation sweep: loop-axis azimuths (in `reference`) and levels; becomes a bearing through fitNullSweep. */
export const sweepInputSchema = base.extend({
  levelUnit: z.enum(['dBm', 'S']).default('dBm'),
  samples: z
    .array(z.object({ azimuthDeg: z.number().min(-360).max(720), level: z.number().min(-200).max(100) }))
    .min(4, 'Take at least four readings, most of them near the null.')
    .max(360),
});
export type SweepInput = z.input<typeof sweepInputSchema>;
