/** The four kinds of notice a club sends; their texts live in PostgreSQL (notice_templates). */
export const TEMPLATE_KEYS = ['first-notice', 'follow-up', 'thank-you', 'utility-referral'] as const;
export type TemplateKey = (typeof TEMPLATE_KEYS)[number];

export const TEMPLATE_TITLES: Record<TemplateKey, string> = {
  'first-notice': 'First notice',
  'follow-up': 'Follow-up',
  'thank-you': 'Thank-you',
  'utility-referral': 'Utility referral',
};

/** Every placeholder a template may use, with what fills it. */
export const PLACEHOLDERS = {
  recipientName: 'The name on the notice, e.g. "The householder"',
  clubName: "The club's name (club settings)",
  clubContactEmail: "The club's contact address (club settings)",
  caseReference: 'The case reference, e.g. QF-2026-0002',
  senderName: 'The coordinator who approved the notice',
  personalNote: 'The personal note typed in the composer (empty if none)',
  reporterName: "The reporter's name, only if they agreed to share it; empty otherwise",
  responseLink: 'The private link to the response page',
  expiresOn: 'The date the response link stops working',
  noticeDate: 'The date the notice is approved',
  firstNoticeDate: 'For a follow-up: the date of the first notice',
} as const;
export type PlaceholderValues = Partial<Record<keyof typeof PLACEHOLDERS, string>>;

/** Invented values for previews in the template editor. */
export const SAMPLE_VALUES: PlaceholderValues = {
  recipientName: 'The householder',
  clubName: 'Quillon Heath Radio Club',
  clubContactEmail: 'committee@example.test',
  caseReference: 'QF-2026-0002',
  senderName: 'Bram Ostrander',
  personalNote: 'We live two streets away and are happy to come round whenever suits you.',
  reporterName: '',
  responseLink: 'https://quietfix.example.test/r/sample-link',
  expiresOn: '1 March 2027',
  noticeDate: '1 December 2026',
  firstNoticeDate: '17 November 2026',
};
