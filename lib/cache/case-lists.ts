import type { Role } from '@/db/types';
import { revisionCache } from './by-revision';

/**
 * The committee's lists of cases (queue pages, the map of all cases) at 100,000 cases: many people
 * reloading the same views cost one revision read each (with the session's user, in the same
 * query: lib/auth/session.ts requireUserAndCasesRevision) until a case changes. Per viewer (role and
 * id: what a viewer may see depends on both) and per exact request; see lib/cache/by-revision.ts.
 * `revision` must have been read before anything the answer is computed from.
 */
const lists = revisionCache<object>();

export async function cachedCaseList<T extends object>(
  viewer: { id: string; role: Role },
  revision: string,
  kind: 'queue' | 'map',
  params: unknown,
  compute: () => Promise<T>,
): Promise<T> {
  return lists(`${kind}\u0000${viewer.role}:${viewer.id}\u0000${JSON.stringify(params)}`, revision, compute) as Promise<T>;
}
