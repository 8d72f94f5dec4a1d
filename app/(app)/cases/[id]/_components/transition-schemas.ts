import type { z } from 'zod';
import { transitionSchema } from '@/lib/validation/cases';

/** The four branches of the server's transition schema, one per form (same objects the server parses). */
export const [locatedSchema, notifiedSchema, resolvedSchema, reopenSchema] = transitionSchema.options;

export type TransitionSchema = typeof locatedSchema | typeof notifiedSchema | typeof resolvedSchema | typeof reopenSchema;
export type TransitionBody = z.output<typeof transitionSchema>;
