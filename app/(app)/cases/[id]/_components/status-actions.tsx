'use client';

import { useState } from 'react';
import type { CaseStatus } from '@/db/types';
import type { CaseDetail, FixView } from '@/lib/hunt/views';
import { ActionMessageBox } from '@/components/ui/action-message';
import type { ActionMessage } from '@/components/hunt/use-case-action';
import { LocateForm } from './locate-form';
import { NotifyForm } from './notify-form';
import { ResolveForm } from './resolve-form';
import { ReopenForm } from './reopen-form';
import { CardSection } from './card-section';

const LABELS: Record<CaseStatus, string> = {
  located: 'Mark as located',
  notified: 'Record a delivered letter',
  resolved: 'Close with an outcome',
  open: 'Back to open',
};

/** The status changes the caller may make (can.transitions), each behind its own small form. */
export function StatusActions({ c, fix, refresh }: { c: CaseDetail; fix?: FixView; refresh: () => Promise<unknown> }) {
  const [open, setOpen] = useState<CaseStatus | null>(null);
  const [message, setMessage] = useState<ActionMessage | null>(null);
  const choices = c.can.transitions.filter((t) => t !== c.status);
  if (choices.length === 0 && !message) return null;

  const onDone = async (m: ActionMessage) => {
    setMessage(m);
    setOpen(null);
    await refresh();
  };
  const props = { c, onDone, onCancel: () => setOpen(null) };

  return (
    <CardSection id="status-actions" title="Move the case on" testId="status-actions">
      <ActionMessageBox message={message} />
      {open === null && (
        <div className="flex flex-wrap gap-2">
          {choices.map((t) => (
            <button
              key={t}
              type="button"
              className={t === 'open' ? 'btn-quiet' : 'btn-primary'}
              onClick={() => {
                setMessage(null);
                setOpen(t);
              }}
            >
              {LABELS[t]}
            </button>
          ))}
        </div>
      )}
      {open === 'located' && <LocateForm {...props} fix={fix} />}
      {open === 'notified' && <NotifyForm {...props} />}
      {open === 'resolved' && <ResolveForm {...props} />}
      {open === 'open' && <ReopenForm {...props} />}
    </CardSection>
  );
}
