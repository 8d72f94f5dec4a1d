import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { requirePageUser } from '@/lib/auth/session';
import { db } from '@/db';
import { getCaseWithRight } from '@/db/cases';
import { noticeAccess } from '@/lib/notices/service';
import { NoticesScreen } from './notices-screen';

export const metadata: Metadata = { title: 'Notices' };

/** Compose, preview, approve and send the case's notices (committee; the assigned hunter sees that they exist and their status). */
export default async function NoticesPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const me = await requirePageUser();
  const c = z.uuid().safeParse(id).success ? await getCaseWithRight(db, me, id, 'view') : undefined;
  if (!c) notFound();
  if (!noticeAccess(me, c).read) {
    return <p className="card">Notices are for the committee and the assigned hunter.</p>;
  }
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={`/cases/${c.id}`}>← {c.reference}</Link>
      </nav>
      <h1 className="text-2xl font-extrabold break-words">Notices for {c.title}</h1>
      <NoticesScreen caseId={c.id} />
    </div>
  );
}
