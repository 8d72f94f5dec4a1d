'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { CaseDetail } from '@/lib/hunt/views';
import { ActionMessageBox } from '@/components/ui/action-message';
import { useCaseAction } from '@/components/hunt/use-case-action';

/** For coordinators: a likely duplicate filed earlier nearby; merge this case into it after a confirm step. */
export function DuplicateBanner({ c, refresh }: { c: CaseDetail; refresh: () => Promise<unknown> }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const action = useCaseAction(refresh);
  const dup = c.possibleDuplicate;
  if (!dup || c.mergedInto) return null;

  async function merge() {
    const r = await action.run<CaseDetail>(`/api/cases/${c.id}/merge`, { body: { intoCaseId: dup!.id, version: c.version } }, `Merged into ${dup!.reference}.`);
    setConfirming(false);
    if (r.ok) router.push(`/cases/${r.data.id}`);
  }

  return (
    <section className="space-y-3 rounded-xl border-l-4 border-flare-500 bg-flare-100 p-4 text-flare-700" aria-labelledby="duplicate-heading" data-testid="duplicate-banner">
      <h2 id="duplicate-heading" className="font-bold">
        Possible duplicate
      </h2>
      <p className="text-ink">
        An earlier case within 500 m shares a band: <Link href={`/cases/${dup.id}`}>{dup.reference}</Link> — {dup.title}.
      </p>
      <ActionMessageBox message={action.message} />
      {c.can.merge &&
        (confirming ? (
          <div className="space-y-2 rounded-lg bg-white p-3 text-ink">
            <p>
              Merge {c.reference} into {dup.reference}? This case stops here and its timeline points to {dup.reference}. It cannot be undone from this page.
            </p>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-danger" onClick={merge} disabled={action.busy}>
                {action.busy ? 'Merging…' : `Yes, merge into ${dup.reference}`}
              </button>
              <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>
                Cancel
              </button>
            </div>
          </div>
        ) : (
          <button type="button" className="btn-quiet" onClick={() => setConfirming(true)}>
            Merge into {dup.reference}
          </button>
        ))}
    </section>
  );
}
