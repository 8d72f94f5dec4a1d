import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { headers } from 'next/headers';
import { authOptions } from './options';
import { getSessionUser } from '@/db/users';
import type { Role, User } from '@/db/types';
import { forbidden, unauthorized } from '@/lib/errors';

/**
 * The signed-in user, read fresh from the database so a deactivated account or a changed
 * role takes effect at once; undefined when signed out. A session that began before the
 * account's last password change or reset carries an older session version and counts as
 * signed out (db/users.ts setPassword bumps the version).
 */
export async function currentUser(): Promise<User | undefined> {
  const session = await getServerSession(authOptions);
  if (!session?.user?.id) return undefined;
  const found = await getSessionUser(session.user.id);
  if (!found?.active || found.sessionVersion !== session.user.sessionVersion) return undefined;
  const { sessionVersion: _, ...user } = found;
  return user;
}

/**
 * Call at the top of every route handler and server action: 401 when signed out,
 * 403 when the role is not among `roles` (no roles given: any signed-in user).
 */
export async function requireUser(...roles: Role[]): Promise<User> {
  const user = await currentUser();
  if (!user) throw unauthorized();
  if (roles.length && !roles.includes(user.role)) throw forbidden();
  return user;
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
