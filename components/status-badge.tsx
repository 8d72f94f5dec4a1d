import type { CaseStatus } from '@/db/types';

const STYLE: Record<CaseStatus, string> = {
  open: 'bg-flare-100 text-flare-700 border-flare-500',
  located: 'bg-hush-50 text-hush-700 border-hush-500',
  notified: 'bg-white text-ink border-ink/40',
  resolved: 'bg-hush-700 text-white border-hush-700',
};

export function StatusBadge({ status }: { status: CaseStatus }) {
  return <span className={`inline-block rounded-full border px-2.5 py-0.5 text-xs font-bold uppercase tracking-wide ${STYLE[status]}`}>{status}</span>;
}
