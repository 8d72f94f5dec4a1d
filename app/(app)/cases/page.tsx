import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/session';
import { listActiveHunters } from '@/db/users';
import { listSavedFilters } from '@/db/queue';
import { mapStart } from '@/db/case-map';
import { isCommittee } from '@/db/case-scope';
import { CaseQueue } from './_components/case-queue';

export const metadata: Metadata = { title: 'Cases' };

const HEADINGS = { admin: 'The queue', coordinator: 'The queue', hunter: 'Cases assigned to you', member: 'Your reports' } as const;

export default async function CasesPage() {
  const user = await requirePageUser();
  const committee = isCommittee(user.role);
  const [hunters, saved, start] = await Promise.all([committee ? listActiveHunters() : [], listSavedFilters(user.id), mapStart(user)]);
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <h1 className="text-2xl font-extrabold">{HEADINGS[user.role]}</h1>
        {committee && (
          <Link href="/stats" className="btn-quiet ml-auto">
            Statistics
          </Link>
        )}
        <Link href="/reports/new" className={`btn-primary ${committee ? '' : 'ml-auto'}`}>
          Report noise
        </Link>
      </div>
      <CaseQueue committee={committee} hunters={hunters} saved={saved} mapStart={start} />
      <p className="text-sm text-ink-faint">
        Before you go out, read the <Link href="/cautions">cautions</Link>.
      </p>
    </div>
  );
}
