import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { requirePageUser } from '@/lib/auth/session';
import { db } from '@/db';
import { getCaseWithRight } from '@/db/cases';
import { CaseView } from './case-view';

export const metadata: Metadata = { title: 'Case' };

export default async function CasePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | undefined>> }) {
  const { id } = await params;
  const me = await requirePageUser();
  // The one access rule, as the API asks it: a case this user may not see is the not-found page.
  if (!z.uuid().safeParse(id).success || !(await getCaseWithRight(db, me, id, 'view'))) notFound();
  const sp = await searchParams;
  return <CaseView caseId={id} justFiled={sp.filed === '1'} />;
}
