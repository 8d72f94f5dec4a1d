import { z } from 'zod';
import { callSignSchema } from './users';

export const LOOP_SHAPES = ['circle', 'square', 'octagon', 'other'] as const;

/** The signed-in person's own profile; a loop is described by shape and size, or by circumference. */
export const profileSchema = z.object({
  name: z.string().trim().min(1).max(120),
  callSign: callSignSchema.nullable(),
  loopShape: z.enum(LOOP_SHAPES).nullable(),
  /** diameter for a circle, side for a square or octagon, circumference for "other"; metres */
  loopSizeM: z.number().positive().max(50).nullable(),
  sMeterOffsetDb: z.number().min(-40).max(40),
  bearingReference: z.enum(['true', 'magnetic']),
});
export type ProfileInput = z.input<typeof profileSchema>;
