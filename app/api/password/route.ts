import { route, json, readJson } from '@/lib/api/handler';
import { redeemToken } from '@/lib/auth/tokens';
import { setPasswordSchema } from '@/lib/validation/users';

/** Sets a password from an invitation or reset link; the link works once. */
export const POST = route(async (req) => {
  const { token, password } = setPasswordSchema.parse(await readJson(req));
  const { email } = await redeemToken(token, password);
  return json({ ok: true, email });
});
