import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { PeopleTable } from './people-table';

export const metadata: Metadata = { title: 'People' };

export default async function PeoplePage() {
  const me = await requirePageUser('admin');
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">People</h1>
      <p className="text-ink-soft">Change roles or deactivate accounts. A deactivated person cannot sign in; their records stay.</p>
      <PeopleTable myId={me.id} />
    </div>
  );
}
