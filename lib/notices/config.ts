import { z } from 'zod';

/**
 * Settings of the notices and the outbox, read from the environment once (the worker process
 * reads them too, so they live here rather than in lib/env.ts's web-app schema).
 */
const schema = z.object({
  NOTICE_TOKEN_SECRET: z.string().min(16).optional(),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  NOTICE_TOKEN_DAYS: z.coerce.number().int().min(1).max(3650).default(90),
  OUTBOX_BACKOFF_BASE_MS: z.coerce.number().int().min(1).default(5000),
  OUTBOX_BACKOFF_CAP_MS: z.coerce.number().int().min(1).default(15 * 60_000),
  OUTBOX_LEASE_MS: z.coerce.number().int().min(100).default(60_000),
  OUTBOX_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(100).default(8),
  OUTBOX_BATCH_SIZE: z.coerce.number().int().min(1).max(500).default(10),
  OUTBOX_POLL_MS: z.coerce.number().int().min(50).default(2000),
  APP_URL: z.url().default('http://localhost:3000'),
  MAIL_FROM: z.string().min(3).default('Quietfix <no-reply@quietfix.example.test>'),
});

export type NoticeConfig = z.infer<typeof schema>;

let cached: NoticeConfig | undefined;
export function noticeConfig(): NoticeConfig {
  if (!cached) {
    const parsed = schema.safeParse(process.env);
    if (!parsed.success) throw new Error(`Quietfix notice settings are invalid: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
    cached = parsed.data;
  }
  return cached;
}

/** The secret response links are derived from; without one no link can be made. */
export function tokenSecret(): string {
  const c = noticeConfig();
  const s = c.NOTICE_TOKEN_SECRET ?? c.NEXTAUTH_SECRET;
  if (!s) throw new Error('Set NOTICE_TOKEN_SECRET (or NEXTAUTH_SECRET): response links are derived from it.');
  return s;
}

/** The domain part of our Message-IDs: the sender address's domain. */
export function messageIdDomain(): string {
  const m = noticeConfig().MAIL_FROM.match(/@([A-Za-z0-9.-]+)/);
  return m?.[1] ?? 'quietfix.example.test';
}
