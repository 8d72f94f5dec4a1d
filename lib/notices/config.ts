import { env, type Env } from '@/lib/env';

/** Settings of the notices and the outbox: the app's one parsed environment (lib/env.ts). */
export type NoticeConfig = Env;
export const noticeConfig = (): NoticeConfig => env;

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
