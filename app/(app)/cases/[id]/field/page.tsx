import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { requirePageUser } from '@/lib/auth/session';
import { db } from '@/db';
import { getCaseWithRight } from '@/db/cases';
import { FieldScreen } from './field-screen';

export const metadata: Metadata = { title: 'In the field' };

/** The phone screen for hunting one case (the one access rule: a case this user may not see is not found). */
export default async function FieldPage({ params }: { params: Promise<{ id: string }> }) {
  const me = await requirePageUser('admin', 'coordinator', 'hunter');
  const { id } = await params;
  if (!z.uuid().safeParse(id).success || !(await getCaseWithRight(db, me, id, 'view'))) notFound();
  return <FieldScreen caseId={id} />;
}
