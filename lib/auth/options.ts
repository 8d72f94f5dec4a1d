import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import bcrypt from 'bcryptjs';
import { z } from 'zod';
import { getCredentials } from '@/db/users';
import { appIsHttps, env } from '@/lib/env';
import { sameOriginPath } from '@/lib/api/same-origin-path';
import { clearFailures, clientOf, recordFailure } from './throttle';

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
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const user = await getCredentials(email);
        const ok = !!user?.passwordHash && user.active && (await bcrypt.compare(password, user.passwordHash));
        if (!ok || !user) {
          const delay = await recordFailure(email, clientOf(req?.headers ?? {}));
          await sleep(delay);
          return null;
        }
        await clearFailures(email);
        return { id: user.id, email: user.email, name: user.name, role: user.role };
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
      }
      return token;
    },
    async session({ session, token }) {
      if (token.uid && token.role) {
        session.user = { id: token.uid, role: token.role, name: token.name ?? '', email: token.email ?? '' };
      }
      return session;
    },
  },
};
