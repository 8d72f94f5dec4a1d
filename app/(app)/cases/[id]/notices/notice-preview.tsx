'use client';

import useSWR from 'swr';
import { useState } from 'react';
import { fetchJson } from '@/lib/api/client';
import { NoticeBox } from '@/components/ui/notice-box';

type Preview = { subject: string; text: string; html: string; frozen: boolean };

/** The notice as the e-mail will read: HTML (in a sandboxed frame, no scripts) or plain text. */
export function NoticePreview({ url, version }: { url: string; version: number }) {
  const { data, error } = useSWR<Preview>(`${url}?v=${version}`, fetchJson);
  const [as, setAs] = useState<'html' | 'text'>('html');
  if (error) return <NoticeBox tone="error">{error.message}</NoticeBox>;
  if (!data) return <p role="status">Loading the preview…</p>;
  return (
    <div className="space-y-2 border-t border-ink/10 pt-2">
      <p className="text-sm">
        <span className="font-semibold">Subject:</span> {data.subject}
      </p>
      <div role="group" aria-label="Preview as" className="flex gap-2">
        <button type="button" className="btn-quiet" aria-pressed={as === 'html'} onClick={() => setAs('html')}>
          E-mail (HTML)
        </button>
        <button type="button" className="btn-quiet" aria-pressed={as === 'text'} onClick={() => setAs('text')}>
          Plain text
        </button>
      </div>
      {as === 'html' ? (
        <iframe title="E-mail preview" sandbox="" srcDoc={data.html} className="h-96 w-full rounded border border-ink/10 bg-white" />
      ) : (
        <pre className="max-h-96 overflow-auto rounded bg-paper-deep p-3 text-sm whitespace-pre-wrap break-words">{data.text}</pre>
      )}
      {!data.frozen && <p className="text-sm text-ink-soft">This is a draft: the text is fixed when a coordinator approves it.</p>}
    </div>
  );
}
