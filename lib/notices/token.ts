import { createHash, createHmac, randomBytes } from 'node:crypto';
import { tokenSecret } from './config';

/**
 * Response links: token = base64url(HMAC-SHA256(secret, noticeId + ':' + nonce)), 256 bits.
 * The notice stores the random nonce and the SHA-256 of the token, never the token: the
 * database alone cannot produce a working link, yet the worker (which knows the secret) can
 * put the link into the e-mail it sends. See lib/notices/README.md.
 */
export const newNonce = () => randomBytes(32).toString('base64url');

export const deriveToken = (noticeId: string, nonce: string) =>
  createHmac('sha256', tokenSecret()).update(`${noticeId}:${nonce}`).digest('base64url');

export const hashResponseToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** A token has the shape of ours (43 base64url characters) before we hash and look it up. */
export const looksLikeToken = (token: string) => /^[A-Za-z0-9_-]{43}$/.test(token);
