'use client';

import { useRef, useState } from 'react';
import { callApi } from '@/lib/api/client';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import { FieldError } from '@/components/ui/field-error';
import { noticeDeliveredSchema } from '@/lib/validation/notices';
import { NoticeBox } from '@/components/ui/notice-box';
import { TEMPLATE_TITLES, type TemplateKey } from '@/lib/notices/templates';
import { hasContact, type NoticeItem } from '@/lib/notices/views';
import { NoticePreview } from './notice-preview';

const today = () => new Date().toISOString().slice(0, 10);

export function NoticeCard({
  caseId,
  n,
  can,
  open,
  onToggle,
  onChanged,
}: {
  caseId: string;
  n: NoticeItem;
  can: { contact: boolean; decide: boolean };
  open: boolean;
  onToggle: () => void;
  onChanged: () => void;
}) {
  const base = `/api/cases/${caseId}/notices/${n.id}`;
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  // The printed letter's delivery date: the one form hook, the date's problem shown under it.
  const delivered = useApiForm(noticeDeliveredSchema, {
    defaultValues: { deliveredOn: today() },
    request: (v) => ({ url: `${base}/delivered`, body: v }),
    onSuccess: onChanged,
    onFailure: onChanged,
  });
  const deliveredError = delivered.form.formState.errors.deliveredOn?.message;
  // One key per card: a double click or a retry of the same request queues the notice once.
  const sendKey = useRef<string>(typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${n.id}-${Date.now()}`);

  async function act(path: string, body: unknown) {
    setBusy(true);
    setProblem(null);
    const r = await callApi(`${base}/${path}`, { body });
    setBusy(false);
    if (!r.ok) setProblem(r.error);
    onChanged();
  }

  const contact = hasContact(n) ? n : null;
  const waiting = n.status === 'queued' && contact?.delivery;
  return (
    <article className="card space-y-2" aria-labelledby={`notice-${n.id}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`notice-${n.id}`} className="font-bold break-words">
          {TEMPLATE_TITLES[n.templateKey as TemplateKey] ?? n.templateKey}
          {contact ? ` to ${contact.recipientName}` : ''}
        </h3>
        <span className="rounded-full bg-hush-50 px-2 py-0.5 text-sm font-semibold" data-testid="notice-status">
          {n.statusLabel}
        </span>
      </div>
      {contact && <p className="text-sm whitespace-pre-line text-ink-soft break-words">{contact.postalAddress}</p>}
      {contact?.email && <p className="text-sm break-all">{contact.email}</p>}
      {waiting && contact.delivery!.lastError && (
        <NoticeBox tone="warn" title="Waiting to send">
          The mail server did not take it yet (try {contact.delivery!.attempts}): {contact.delivery!.lastError}. Quietfix keeps trying
          {contact.delivery!.nextAttemptAt ? `; next at ${new Date(contact.delivery!.nextAttemptAt).toLocaleTimeString('en-GB')}` : ''}. Nothing is lost.
        </NoticeBox>
      )}
      {n.status === 'failed' && contact?.delivery && (
        <NoticeBox tone="error" title="Sending failed">
          After {contact.delivery.attempts} tries the mail server still refused: {contact.delivery.lastError}
        </NoticeBox>
      )}
      {!!contact?.answers && <p className="text-sm font-semibold">{contact.answers === 1 ? 'One answer' : `${contact.answers} answers`} from the household (see the timeline).</p>}
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <div className="flex flex-wrap gap-2">
        {can.contact && (
          <>
            <button type="button" className="btn-quiet" aria-expanded={open} onClick={onToggle}>
              {open ? 'Hide preview' : 'Preview'}
            </button>
            <a className="btn-quiet" href={`${base}/letter`} target="_blank" rel="noreferrer">
              Letter (PDF)
            </a>
          </>
        )}
        {can.decide && n.status === 'draft' && (
          <button type="button" className="btn-primary" disabled={busy} onClick={() => act('approve', { version: n.version })}>
            Approve
          </button>
        )}
        {can.decide && n.status === 'approved' && contact?.email && (
          <button type="button" className="btn-primary" disabled={busy} onClick={() => act('send', { idempotencyKey: sendKey.current })}>
            Send by e-mail
          </button>
        )}
        {can.decide && n.status === 'failed' && (
          <button type="button" className="btn-primary" disabled={busy} onClick={() => act('retry', {})}>
            Try again
          </button>
        )}
      </div>
      {can.decide && (n.status === 'approved' || n.status === 'failed') && (
        <form className="space-y-2" onSubmit={delivered.submit} noValidate>
          <div className="flex flex-wrap items-end gap-2">
            <div>
              <label htmlFor={`delivered-${n.id}`} className="label">
                Printed letter delivered on
              </label>
              <input
                id={`delivered-${n.id}`}
                type="date"
                className="field"
                max={today()}
                aria-invalid={!!deliveredError}
                aria-describedby={deliveredError ? `delivered-${n.id}-problem` : undefined}
                {...delivered.form.register('deliveredOn')}
              />
            </div>
            <button type="submit" className="btn-quiet" disabled={busy || delivered.pending}>
              Mark delivered
            </button>
          </div>
          <FieldError id={`delivered-${n.id}-problem`} message={deliveredError} />
          <FormProblemBox problem={delivered.problem} />
        </form>
      )}
      {open && can.contact && <NoticePreview url={`${base}/preview`} version={n.version} />}
    </article>
  );
}
