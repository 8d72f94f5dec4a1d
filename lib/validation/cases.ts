import { z } from 'zod';
import { CASE_STATUSES } from '@/db/types';
import { safeText } from './text';

export const SOUND_KINDS = {
  buzz: 'Rough buzz (mains hum on it)',
  hash: 'Wideband hash or rasp',
  hiss: 'Smooth hiss, raised noise floor',
  clicks: 'Clicks, ticks or crackles',
  warble: 'Warbling or sweeping tones',
  carriers: 'Steady carriers at regular spacing',
  whine: 'Whine that changes pitch',
  other: 'Something else (describe it)',
} as const;
export const soundKindSchema = z.enum(Object.keys(SOUND_KINDS) as [keyof typeof SOUND_KINDS, ...(keyof typeof SOUND_KINDS)[]]);

export const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;

export const OUTCOMES = {
  'fixed-by-owner': 'Fixed by the owner',
  mitigated: 'Mitigated (reduced, not gone)',
  'utility-repaired': 'Utility repaired its hardware',
  'referred-to-regulator': 'Referred to the regulator',
  'stopped-on-its-own': 'Stopped on its own',
  'not-found': 'Source not found',
  duplicate: 'Duplicate of another case',
} as const;
export const outcomeSchema = z.enum(Object.keys(OUTCOMES) as [keyof typeof OUTCOMES, ...(keyof typeof OUTCOMES)[]]);

export const positionSchema = z.object({
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
  accuracyM: z.number().min(0).max(100_000).optional(),
  source: z.enum(['device', 'map']),
});

export const frequencySchema = z.object({
  value: z.number({ error: 'Type a number.' }).positive('Must be above zero.'),
  unit: z.enum(['kHz', 'MHz']),
});

export const levelSchema = z.discriminatedUnion('unit', [
  z.object({ unit: z.literal('S'), sUnits: z.number().int().min(0).max(9), overDb: z.number().min(0).max(80).default(0) }),
  z.object({ unit: z.literal('dBm'), dbm: z.number().min(-170).max(0) }),
]);

export const scheduleSchema = z.object({
  days: z.array(z.enum(WEEKDAYS)).max(7).default([]),
  fromHour: z.number().int().min(0).max(23).optional(),
  toHour: z.number().int().min(0).max(24).optional(),
  pattern: z.enum(['continuous', 'intermittent']),
  note: safeText().trim().max(300).default(''),
});

/** A member's noise report: becomes a new case. Frequencies in kHz or MHz as typed; the level is stored in dBm. */
export const reportSchema = z
  .object({
    title: safeText().trim().min(3, 'Give it a short title.').max(120),
    sound: soundKindSchema,
    soundNote: safeText().trim().max(500).default(''),
    description: safeText().trim().max(2000).default(''),
    frequencies: z.array(frequencySchema).min(1, 'Add at least one frequency.').max(12),
    level: levelSchema.optional(),
    schedule: scheduleSchema,
    position: positionSchema,
    consentShareName: z.boolean().default(false),
  })
  .refine((r) => r.sound !== 'other' || r.soundNote.length > 0, { message: 'Describe the sound.', path: ['soundNote'] })
  .refine((r) => r.frequencies.every((f) => (f.unit === 'MHz' ? f.value * 1000 : f.value) <= 3_000_000), {
    message: 'Frequencies above 3 GHz are out of scope.',
    path: ['frequencies'],
  });
export type ReportInput = z.input<typeof reportSchema>;

const version = z.number().int().min(1);

/** Coordinator edits and assignment. */
export const casePatchSchema = z.object({
  version,
  assigneeId: z.uuid().nullable().optional(),
  title: safeText().trim().min(3).max(120).optional(),
  description: safeText().trim().max(2000).optional(),
});

export const transitionSchema = z.discriminatedUnion('to', [
  z.object({ to: z.literal('located'), version, evidence: z.enum(['fix', 'premises']), note: safeText().trim().max(1000).default('') }),
  z.object({
    to: z.literal('notified'),
    version,
    method: z.literal('hand-delivered'),
    deliveredOn: z.iso.date('Give the date the letter was delivered.'),
    note: safeText().trim().max(1000).default(''),
  }),
  z.object({
    to: z.literal('resolved'),
    version,
    outcome: outcomeSchema,
    levelBeforeDbm: z.number().min(-170).max(0).optional(),
    levelAfterDbm: z.number().min(-170).max(0).optional(),
    note: safeText().trim().max(1000).default(''),
  }),
  z.object({ to: z.literal('open'), version, reason: safeText().trim().min(3, 'Say why the case goes back to open.').max(1000) }),
]);
export type TransitionInput = z.input<typeof transitionSchema>;

export const commentSchema = z.object({
  text: safeText().trim().min(1, 'Write something.').max(4000),
  /** A hunter saying the premises are confirmed (evidence a coordinator can agree to). */
  premisesConfirmed: z.boolean().default(false),
});

export const mergeSchema = z.object({ intoCaseId: z.uuid(), version });

