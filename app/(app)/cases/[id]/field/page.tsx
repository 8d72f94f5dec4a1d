import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { requirePageUser } from '@/lib/auth/session';
import { FieldScreen } from './field-screen';

export const metadata: Metadata = { title: 'In the field' };

/** The phone screen for hunting one case; the API checks access to the case itself. */
export default async function FieldPage({ params }: { params: Promise<{ id: string }> }) {
  await requirePageUser('admin', 'coordinator', 'hunter');
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) notFound();
  return <FieldScreen caseId={id} />;
}
