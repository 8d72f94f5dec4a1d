import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/session';
import { StatsView } from './stats-view';

export const metadata: Metadata = { title: 'Statistics' };

/** The committee's figures; the queue's filters in the address apply here too. */
export default async function StatsPage() {
  await requirePageUser('admin', 'coordinator');
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <h1 className="text-2xl font-extrabold">Statistics</h1>
        <Link href="/cases" className="btn-quiet ml-auto">
          Back to the queue
        </Link>
      </div>
      <StatsView />
    </div>
  );
}
