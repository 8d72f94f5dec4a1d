import { z } from 'zod';
import { safeText } from './text';

export const NOISE_ENVIRONMENTS = ['city', 'residential', 'rural', 'quiet-rural'] as const;

/** The club settings an admin edits; every field optional (only what is sent changes). */
export const clubSettingsPatchSchema = z
  .object({
    clubName: safeText().trim().min(2, 'Give the club a name.').max(120),
    contactEmail: z.email('An e-mail address, please.').max(200),
    locateThresholdM: z.number().min(5, 'At least 5 m.').max(2000, 'At most 2,000 m.'),
    reminderDays: z.number().int().min(1).max(365),
    maxPositionAccuracyM: z.number().min(1).max(1000),
    noiseEnvironment: z.enum(NOISE_ENVIRONMENTS),
    uploadMaxMb: z.number().int().min(1).max(1000),
  })
  .partial();
