import { z } from 'zod';
import { TEMPLATE_KEYS } from '@/lib/notices/templates';

const version = z.number().int().min(1);

/** A notice as the composer fills it in; create and edit share it. */
export const noticeBaseSchema = z.object({
  templateKey: z.enum(TEMPLATE_KEYS),
  recipientName: z.string().trim().min(2, 'Give a name, e.g. "The householder".').max(120),
  postalAddress: z
    .string()
    .trim()
    .min(5, 'Give the postal address: the letter needs it, and it keeps one notice per household.')
    .max(400)
    .refine((a) => /[a-z0-9]/i.test(a), 'The address needs letters or digits.'),
  email: z.union([z.literal(''), z.email('That does not look like an e-mail address.').max(200)]).default(''),
  personalNote: z.string().trim().max(1500, 'Keep the note under 1500 characters.').default(''),
});
export type NoticeInput = z.input<typeof noticeBaseSchema>;

export const noticeCreateSchema = noticeBaseSchema;
export const noticePatchSchema = noticeBaseSchema.partial().extend({ version });
export const noticeApproveSchema = z.object({ version });
export const noticeSendSchema = z.object({
  idempotencyKey: z.string().trim().min(8, 'A send needs an idempotency key of at least 8 characters.').max(100),
});
export const noticeDeliveredSchema = z.object({ deliveredOn: z.iso.date('Give the date the letter was delivered.') });
export const noticeIdsSchema = z.object({ id: z.uuid('Not a case id.'), noticeId: z.uuid('Not a notice id.') });

export const templateKeySchema = z.object({ key: z.enum(TEMPLATE_KEYS, 'No such template.') });
export const templatePutSchema = z.object({
  version,
  subject: z.string().trim().min(3, 'Give a subject.').max(200),
  body: z.string().trim().min(20, 'The text is too short to be a notice.').max(20_000),
});

export const ANSWER_KINDS = {
  'will-check': 'I will check my devices',
  'not-mine': 'I don’t think it is mine',
  'contact-me': 'Please contact me',
  'fixed-it': 'I have fixed it',
  other: 'Something else',
} as const;

/** The recipient's answer on the public page. */
export const answerSchema = z
  .object({
    kind: z.enum(Object.keys(ANSWER_KINDS) as [keyof typeof ANSWER_KINDS, ...(keyof typeof ANSWER_KINDS)[]], 'Choose one of the answers.'),
    message: z.string().trim().max(2000, 'Keep the message under 2000 characters.').default(''),
    contact: z.string().trim().max(200, 'Keep the contact details short.').default(''),
  })
  .refine((a) => a.kind !== 'contact-me' || a.contact.length >= 5, { message: 'Tell us how to reach you (a phone number or e-mail address).', path: ['contact'] })
  .refine((a) => a.kind !== 'other' || a.message.length > 0, { message: 'Write a few words.', path: ['message'] });
export type AnswerInput = z.input<typeof answerSchema>;
