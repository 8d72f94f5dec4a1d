import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { requirePageUser } from '@/lib/auth/session';
import { getCase } from '@/db/cases';
import { CaseView } from './case-view';

export const metadata: Metadata = { title: 'Case' };

export default async function CasePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | undefined>> }) {
  const { id } = await params;
  await requirePageUser();
  // Who may see the case is decided by GET /api/cases/:id; here we only turn a missing case into the not-found page.
  if (!z.uuid().safeParse(id).success || !(await getCase(id))) notFound();
  const sp = await searchParams;
  return <CaseView caseId={id} justFiled={sp.filed === '1'} />;
}
