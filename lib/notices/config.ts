import { env } from '@/lib/env';

/** An address inside the app, e.g. appUrl('/r/abc'): APP_URL without a trailing slash, then the path. */
export const appUrl = (path: string) => `${env.APP_URL.replace(/\/$/, '')}${path}`;

/** When a response link made now stops working (NOTICE_TOKEN_DAYS). */
export const linkExpiry = (now = Date.now()) => new Date(now + env.NOTICE_TOKEN_DAYS * 86_400_000);

/** The secret response links are derived from; without one no link can be made. */
export function tokenSecret(): string {
  const s = env.NOTICE_TOKEN_SECRET ?? env.NEXTAUTH_SECRET;
  if (!s) throw new Error('Set NOTICE_TOKEN_SECRET (or NEXTAUTH_SECRET): response links are derived from it.');
  return s;
}

/** The domain part of our Message-IDs: the sender address's domain. */
export function messageIdDomain(): string {
  const m = env.MAIL_FROM.match(/@([A-Za-z0-9.-]+)/);
  return m?.[1] ?? 'quietfix.example.test';
}
