'use client';

import type { UploadState } from './use-uploads';

const WORDS: Record<UploadState['phase'], string> = {
  asking: 'Preparing…',
  sending: 'Sending…',
  checking: 'Checking the content…',
  done: 'Attached',
  failed: 'Not attached',
  cancelled: 'Cancelled',
};

const mb = (n: number) => `${(n / 1_000_000).toFixed(1)} MB`;

/** One upload in progress: a real progress bar of the bytes sent, cancel while sending, retry after. */
export function UploadRow({ u, onCancel, onRetry, onDismiss }: { u: UploadState; onCancel: () => void; onRetry: () => void; onDismiss: () => void }) {
  const pct = u.total ? Math.round((100 * u.sent) / u.total) : 0;
  return (
    <li className="space-y-1 rounded-lg border border-ink/10 p-2" data-testid="upload-row" data-phase={u.phase}>
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <span className="min-w-0 truncate font-semibold">{u.file.name}</span>
        <span role="status">
          {WORDS[u.phase]}
          {u.phase === 'sending' && ` ${pct} % of ${mb(u.total)}`}
        </span>
      </div>
      <progress className="h-2 w-full" max={u.total || 1} value={u.sent} aria-label={`Upload of ${u.file.name}`} data-testid="upload-progress" />
      {u.error && <p className="text-sm text-alarm-600">{u.error}</p>}
      <div className="flex gap-2">
        {u.phase === 'sending' && (
          <button type="button" className="btn-quiet" onClick={onCancel}>
            Cancel
          </button>
        )}
        {(u.phase === 'failed' || u.phase === 'cancelled') && (
          <button type="button" className="btn-quiet" onClick={onRetry}>
            Try again
          </button>
        )}
        {(u.phase === 'done' || u.phase === 'failed' || u.phase === 'cancelled') && (
          <button type="button" className="btn-quiet" onClick={onDismiss}>
            Hide
          </button>
        )}
      </div>
    </li>
  );
}
