import { LRUCache } from 'lru-cache';
import { decode, getToken, type JWT } from 'next-auth/jwt';
import { redirect } from 'next/navigation';
import { cookies, headers } from 'next/headers';
import { appIsHttps, env } from '@/lib/env';
import { getSessionUser, getSessionUserAndCasesRevision, type SessionUser } from '@/db/users';
import type { Role, User } from '@/db/types';
import { forbidden, unauthorized } from '@/lib/errors';

/** jose's allowance when next-auth checks a token's expiry (next-auth/jwt decode). */
const CLOCK_TOLERANCE_S = 15;

/**
 * Session tokens already decrypted, by their exact text. Decrypting one (a key derivation and an
 * AES-GCM open) was the largest share of a request's own CPU time; a token's text always decrypts
 * to the same claims, so a token seen before is trusted until its own expiry. Only what a token
 * says is cached: who the user is now is read from the database on every request.
 */
const decoded = new LRUCache<string, JWT>({ max: 10_000, ttl: 10 * 60_000 });

async function decodeOnce({ token, secret }: { token?: string; secret: string | Buffer }): Promise<JWT | null> {
  if (!token) return null;
  const now = Date.now() / 1000;
  const known = decoded.get(token);
  if (known) return typeof known.exp === 'number' && known.exp + CLOCK_TOLERANCE_S < now ? null : known;
  const claims = await decode({ token, secret });
  if (claims) decoded.set(token, claims);
  return claims;
}

/**
 * The signed-in user, read fresh from the database so a deactivated account or a changed
 * role takes effect at once; undefined when signed out. A session that began before the
 * account's last password change or reset carries an older session version and counts as
 * signed out (db/users.ts setPassword bumps the version). The session cookie is read here with
 * next-auth's own reader (getToken: chunked cookies, secure prefix) rather than through
 * getServerSession, which would re-encrypt a fresh token on every call only to discard it
 * (a route handler cannot roll the cookie; the browser's session refresh does).
 */
export async function currentUser(): Promise<User | undefined> {
  return (await readSession(getSessionUser))?.user;
}

/** The session's user id, or undefined: the cookie read and decoded (once per token text). */
async function sessionUid(): Promise<{ uid: string; sv: number } | undefined> {
  const jar = await cookies();
  const token = await getToken({
    // Cookies only: no Authorization header, so a bearer token is never taken for a session.
    req: { cookies: jar, headers: {} } as unknown as Parameters<typeof getToken>[0]['req'],
    secret: env.NEXTAUTH_SECRET,
    secureCookie: appIsHttps,
    decode: decodeOnce,
  });
  return token?.uid ? { uid: token.uid, sv: token.sv ?? 0 } : undefined;
}

/** The session's user through `read` (a db/users.ts reader), when active and of the current session version. */
async function readSession<R extends SessionUser>(read: (id: string) => Promise<R | undefined>): Promise<{ user: User; row: R } | undefined> {
  const session = await sessionUid();
  if (!session) return undefined;
  const found = await read(session.uid);
  if (!found?.active || found.sessionVersion !== session.sv) return undefined;
  const { sessionVersion: _v, casesRevision: _r, ...user } = found as SessionUser & { casesRevision?: string };
  return { user, row: found };
}

function allowed(user: User | undefined, roles: Role[]): User {
  if (!user) throw unauthorized();
  if (roles.length && !roles.includes(user.role)) throw forbidden();
  return user;
}

/**
 * Call at the top of every route handler and server action: 401 when signed out,
 * 403 when the role is not among `roles` (no roles given: any signed-in user).
 */
export async function requireUser(...roles: Role[]): Promise<User> {
  return allowed(await currentUser(), roles);
}

/**
 * requireUser, with the committed revision of the case lists read in the same query (for
 * lib/cache/case-lists.ts: one round trip instead of two on the committee's busiest answers).
 * Read before anything else the request does, so an answer kept under it is never older.
 */
export async function requireUserAndCasesRevision(...roles: Role[]): Promise<{ me: User; casesRevision: string }> {
  const found = await readSession(getSessionUserAndCasesRevision);
  return { me: allowed(found?.user, roles), casesRevision: found!.row.casesRevision };
}

/** The same check for pages: signed out -> sign-in and back; wrong role -> the forbidden page. */
export async function requirePageUser(...roles: Role[]): Promise<User> {
  const user = await currentUser();
  if (!user) {
    const path = (await headers()).get('x-quietfix-path') ?? '/cases';
    redirect(`/sign-in?next=${encodeURIComponent(path)}`);
  }
  if (roles.length && !roles.includes(user.role)) redirect('/forbidden');
  return user;
}
