import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { ReportForm } from './report-form';

export const metadata: Metadata = { title: 'Report noise' };

export default async function ReportNoisePage() {
  await requirePageUser();
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <h1 className="text-2xl font-extrabold">Report local radio noise</h1>
      <p className="text-ink-soft">
        Tell the committee what you hear, where and when. A volunteer may take bearings from public ground nearby; nobody will knock on a neighbour’s
        door on your behalf without a polite letter first.
      </p>
      <ReportForm />
    </div>
  );
}
