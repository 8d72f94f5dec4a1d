import { z } from 'zod';
import { safeText } from './text';

/** Asking for an upload: the file's name, size in bytes and the type the browser claims. */
export const uploadRequestSchema = z.object({
  name: safeText()
    .trim()
    .min(1, 'The file needs a name.')
    .max(200, 'File names are limited to 200 characters.')
    .refine((n) => !/[\\/]/.test(n), 'A file name cannot contain slashes.'),
  size: z.number().int('The size is a whole number of bytes.').positive('The file is empty.'),
  contentType: safeText().trim().min(3).max(100),
});

export const fileIdSchema = z.object({ id: z.uuid('Not a case id.'), fileId: z.uuid('Not a file id.') });
