import { route, json, readJson } from '@/lib/api/handler';
import { requestPasswordReset } from '@/lib/auth/tokens';
import { clientOf, countResetRequest } from '@/lib/auth/throttle';
import { forgotPasswordSchema } from '@/lib/validation/users';
import { tooManyRequests } from '@/lib/errors';

/**
 * Always the same answer, in about the same time, so the form does not reveal who has an
 * account: the mail is queued (never sent inside the request), and every answer is held until
 * ANSWER_AFTER_MS after the request arrived, which covers the few milliseconds the known-address
 * path spends writing its link and outbox row.
 */
const ANSWER_AFTER_MS = 150;
const holdUntil = (t0: number) => new Promise((r) => setTimeout(r, Math.max(0, t0 + ANSWER_AFTER_MS - Date.now())));

export const POST = route(async (req) => {
  const t0 = Date.now();
  const { email } = forgotPasswordSchema.parse(await readJson(req));
  const limit = await countResetRequest(email, clientOf(req.headers));
  if (limit.blocked) {
    await holdUntil(t0);
    throw tooManyRequests(`Too many reset requests. Wait ${Math.ceil(limit.retryAfterS / 60)} minutes and try again.`, limit.retryAfterS);
  }
  await requestPasswordReset(email);
  await holdUntil(t0);
  return json({ ok: true, message: 'If that address has an account, a link is on its way.' }, 202);
});
