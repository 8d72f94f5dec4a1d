import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';
import { getCredentials } from '@/db/users';
import { appIsHttps, env } from '@/lib/env';
import { sameOriginPath } from '@/lib/api/same-origin-path';
import { verifyPassword } from './password';
import { clientOf, failureDelayMs, signInHits, signInSucceeded } from './throttle';

const credentialsSchema = z.object({ email: z.email().max(254), password: z.string().min(1).max(200) });

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export const authOptions: NextAuthOptions = {
  secret: env.NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  useSecureCookies: appIsHttps,
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      // The attempt was already counted (and refused over the limit) by the POST handler in
      // app/api/auth/[...nextauth]/route.ts. Known or not, one bcrypt comparison runs, so the
      // answer takes as long for an address without an account as for a wrong password.
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const client = clientOf(req?.headers ?? {});
        const user = await getCredentials(email);
        const ok = await verifyPassword(password, user?.passwordHash, !!user?.active);
        if (!ok || !user) {
          await sleep(failureDelayMs(await signInHits(email, client)));
          return null;
        }
        await signInSucceeded(email, client);
        return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    /** A callbackUrl (parameter or cookie) is followed only to a path on this site; anything else goes home. */
    async redirect({ url, baseUrl }) {
      const path = sameOriginPath(url, baseUrl);
      return path ? new URL(path, baseUrl).href : baseUrl;
    },
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.role = user.role;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    async session({ session, token }) {
      if (token.uid && token.role) {
        session.user = { id: token.uid, role: token.role, name: token.name ?? '', email: token.email ?? '', sessionVersion: token.sv ?? 0 };
      }
      return session;
    },
  },
};
