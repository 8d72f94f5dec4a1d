import type { Metadata } from 'next';
import { CautionList } from '@/components/cautions';

export const metadata: Metadata = { title: 'Cautions' };

export default function CautionsPage() {
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-extrabold">Before you hunt: cautions</h1>
      <p className="max-w-2xl text-ink-soft">
        Noise hunting is detective work in other people&apos;s neighbourhoods. It stays safe and friendly when everyone keeps to these
        points.
      </p>
      <CautionList />
      <p className="max-w-2xl text-sm text-ink-faint">
        Quietfix is a record-keeping and calculation tool. It does not grant any right to enter property or to demand changes; what
        counts as harmful interference is for your licensing regulator and local law.
      </p>
    </div>
  );
}
