import { z } from 'zod';
import { TEMPLATE_KEYS } from '@/lib/notices/templates';
import { safeText } from './text';

const version = z.number().int().min(1);

const emailOrEmpty = z.union([z.literal(''), z.email('That does not look like an e-mail address.').max(200)]);
const personalNote = safeText().trim().max(1500, 'Keep the note under 1500 characters.');

/** What a notice draft holds, without defaults: the patch schema makes every field optional. */
const noticeFields = z.object({
  templateKey: z.enum(TEMPLATE_KEYS),
  recipientName: safeText().trim().min(2, 'Give a name, e.g. "The householder".').max(120),
  postalAddress: safeText()
    .trim()
    .min(5, 'Give the postal address: the letter needs it, and it keeps one notice per household.')
    .max(400)
    .refine((a) => /[a-z0-9]/i.test(a), 'The address needs letters or digits.'),
  email: emailOrEmpty,
  personalNote,
});

/** A new notice as the composer fills it in; e-mail and note may be left out (empty). */
export const noticeBaseSchema = noticeFields.extend({ email: emailOrEmpty.default(''), personalNote: personalNote.default('') });
export type NoticeInput = z.input<typeof noticeBaseSchema>;

export const noticeCreateSchema = noticeBaseSchema;
/** An edit of a draft: only the fields it names change. */
export const noticePatchSchema = noticeFields.partial().extend({ version });
export const noticeApproveSchema = z.object({ version });
export const noticeSendSchema = z.object({
  idempotencyKey: safeText().trim().min(8, 'A send needs an idempotency key of at least 8 characters.').max(100),
});
export const noticeDeliveredSchema = z.object({ deliveredOn: z.iso.date('Give the date the letter was delivered.') });
export const noticeIdsSchema = z.object({ id: z.uuid('Not a case id.'), noticeId: z.uuid('Not a notice id.') });

export const templateKeySchema = z.object({ key: z.enum(TEMPLATE_KEYS, 'No such template.') });
export const templatePutSchema = z.object({
  version,
  subject: safeText().trim().min(3, 'Give a subject.').max(200),
  body: safeText().trim().min(20, 'The text is too short to be a notice.').max(20_000),
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
    message: safeText().trim().max(2000, 'Keep the message under 2000 characters.').default(''),
    contact: safeText().trim().max(200, 'Keep the contact details short.').default(''),
  })
  .refine((a) => a.kind !== 'contact-me' || a.contact.length >= 5, { message: 'Tell us how to reach you (a phone number or e-mail address).', path: ['contact'] })
  .refine((a) => a.kind !== 'other' || a.message.length > 0, { message: 'Write a few words.', path: ['message'] });
export type AnswerInput = z.input<typeof answerSchema>;
