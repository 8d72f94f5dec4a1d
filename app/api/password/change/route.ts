import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { clientOf, countSignInAttempt, signInSucceeded } from '@/lib/auth/throttle';
import { changePassword } from '@/lib/auth/tokens';
import { changePasswordSchema } from '@/lib/validation/users';
import { tooManyRequests } from '@/lib/errors';

/**
 * A signed-in user changes their password. Guessing the current one is limited like sign-in
 * (same counters); on success every session of the account ends, this one too, and open reset
 * links retire: the answer says to sign in again.
 */
export const POST = route(async (req) => {
  const me = await requireUser();
  const { current, password } = changePasswordSchema.parse(await readJson(req));
  const client = clientOf(req.headers);
  const limit = await countSignInAttempt(me.email, client);
  if (limit.blocked) throw tooManyRequests('Too many tries of the current password. Wait a while, or use "Forgot password".', limit.retryAfterS);
  await changePassword(me, current, password);
  await signInSucceeded(me.email, client);
  return json({ ok: true, signInAgain: true, message: 'Password changed. Sign in again with the new one.' });
});
