import Link from 'next/link';
import type { CaseDetail } from '@/lib/hunt/views';
import { StatusBadge } from '@/components/status-badge';

/** Reference, title, status and bands; a merged case points to the one it joined. */
export function CaseHeader({ c }: { c: CaseDetail }) {
  return (
    <header className="space-y-2">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span className="font-mono text-sm text-ink-faint" data-testid="case-reference">
          {c.reference}
        </span>
        <span data-testid="case-status">
          <StatusBadge status={c.status} />
        </span>
        {c.bands.length > 0 && <span className="text-sm text-ink-soft">{c.bands.join(', ')}</span>}
      </div>
      <h1 className="text-2xl font-extrabold break-words" data-testid="case-title">
        {c.title}
      </h1>
      {c.mergedInto && (
        <p className="rounded-lg border-l-4 border-hush-500 bg-hush-50 p-3 text-hush-900" data-testid="merged-into">
          This case was merged into <Link href={`/cases/${c.mergedInto.id}`}>{c.mergedInto.reference}</Link>; follow it there.
        </p>
      )}
    </header>
  );
}
