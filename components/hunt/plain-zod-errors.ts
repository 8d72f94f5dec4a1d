import type { z } from 'zod';

/**
 * Plain-language messages for the generic zod issues a hunt form can raise (schema-level messages,
 * such as the sweep's "take at least four readings", still win). Pass as zodResolver's `error`.
 */
export const plainZodErrors: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === 'invalid_type' && issue.expected === 'number') return 'Enter a number.';
  if (issue.code === 'too_small' && issue.origin === 'number') return `Enter ${String(issue.minimum)} or more.`;
  if (issue.code === 'too_big' && issue.origin === 'number') return `Enter ${String(issue.maximum)} or less.`;
  return undefined;
};
