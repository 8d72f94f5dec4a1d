import { z } from 'zod';
import { callSignSchema } from './users';
import { safeText } from './text';

export const LOOP_SHAPES = ['circle', 'square', 'octagon', 'other'] as const;

/** The signed-in person's own profile; a loop is described by shape and size, or by circumference. */
export const profileSchema = z.object({
  name: safeText().trim().min(1).max(120),
  callSign: callSignSchema.nullable(),
  loopShape: z.enum(LOOP_SHAPES).nullable(),
  /** diameter for a circle, side for a square or octagon, circumference for "other"; metres */
  loopSizeM: z.number().positive().max(50).nullable(),
  sMeterOffsetDb: z.number().min(-40).max(40),
  bearingReference: z.enum(['true', 'magnetic']),
});
export type ProfileInput = z.input<typeof profileSchema>;

/** PATCH /api/profile: only the fields named change (the loop's circumference is worked out from the merged result). */
export const profilePatchSchema = profileSchema.partial().refine((p) => Object.values(p).some((v) => v !== undefined), {
  message: 'Change at least one field.',
});
