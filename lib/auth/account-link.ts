import { createHash, createHmac } from 'node:crypto';
import { env } from '@/lib/env';

/**
 * Invitation and reset links: token = base64url(HMAC-SHA256(NEXTAUTH_SECRET, 'account-link:' +
 * rowId + ':' + nonce)), 256 bits. The user_tokens row keeps the nonce and SHA-256(token): the
 * database alone cannot produce a working link, and the outbox worker (which has the secret)
 * derives it when it sends the e-mail, so the outbox never stores a link either.
 */
function linkSecret(): string {
  if (!env.NEXTAUTH_SECRET) throw new Error('Set NEXTAUTH_SECRET: invitation and reset links are derived from it.');
  return env.NEXTAUTH_SECRET;
}

export const deriveAccountToken = (id: string, nonce: string) => createHmac('sha256', linkSecret()).update(`account-link:${id}:${nonce}`).digest('base64url');
export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
export const accountLink = (token: string) => `${env.APP_URL}/set-password?token=${encodeURIComponent(token)}`;
