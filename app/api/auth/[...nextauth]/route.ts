import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { authOptions } from '@/lib/auth/options';
import { clientOf, countSignInAttempt } from '@/lib/auth/throttle';
import { route, type RouteContext } from '@/lib/api/handler';
import { badRequest, tooManyRequests } from '@/lib/errors';
import { textProblem } from '@/lib/validation/text';

const nextAuth = NextAuth(authOptions);

export const GET = nextAuth;

/**
 * Every credential sign-in is counted before the password is looked at (one atomic upsert per
 * key, lib/auth/throttle.ts): over the limit -> 429 with a plain message and no bcrypt at all,
 * so a parallel burst is evaluated at most up to the limit.
 * next-auth's POSTs are forms with its own CSRF token: route() refuses a foreign Origin, and a
 * request with no Origin at all (a script) goes on to that token check.
 */
export const POST = route<{ nextauth: string[] }>({ body: 'form', ownCsrfToken: true }, async (req: NextRequest, ctx: RouteContext<{ nextauth: string[] }>) => {
  const { nextauth } = await ctx.params;
  if (nextauth?.[0] === 'callback' && nextauth[1] === 'credentials') {
    const form = await req.clone().formData().catch(() => undefined);
    const email = String(form?.get('email') ?? '');
    const problem = textProblem(email);
    if (problem) throw badRequest(problem);
    const { blocked, retryAfterS } = await countSignInAttempt(email, clientOf(req.headers));
    if (blocked) {
      throw tooManyRequests(
        `Too many sign-in attempts. Wait ${Math.ceil(retryAfterS / 60)} minutes, or use "Forgot password" to set a new one.`,
        retryAfterS,
      );
    }
  }
  return nextAuth(req, ctx);
});
