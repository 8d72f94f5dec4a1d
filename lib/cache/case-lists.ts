import { dataRevision } from '@/db/revisions';
import type { Role } from '@/db/types';
import { revisionCache } from './by-revision';

/**
 * The committee's lists of cases (queue pages, the map of all cases) at 100,000 cases: many people
 * reloading the same views cost one revision read each until a case changes. Per viewer (role and
 * id: what a viewer may see depends on both) and per exact request; see lib/cache/by-revision.ts.
 */
const lists = revisionCache<object>();

export async function cachedCaseList<T extends object>(viewer: { id: string; role: Role }, kind: 'queue' | 'map', params: unknown, compute: () => Promise<T>): Promise<T> {
  const revision = await dataRevision('cases');
  return lists(`${kind}\u0000${viewer.role}:${viewer.id}\u0000${JSON.stringify(params)}`, revision, compute) as Promise<T>;
}
