'use client';

import { useCallback, useRef, useState } from 'react';
import { callApi } from '@/lib/api/client';

/**
 * Uploads of evidence files, several at once: ask the server for a presigned PUT, send the bytes
 * straight to object storage with XMLHttpRequest (the only browser API that reports upload
 * progress), then ask the server to check the content. Each can be cancelled and retried.
 */
export type UploadState = {
  key: string;
  file: File;
  phase: 'asking' | 'sending' | 'checking' | 'done' | 'failed' | 'cancelled';
  sent: number;
  total: number;
  error?: string;
};

type Ticket = { fileId: string; uploadUrl: string; method: 'PUT'; headers: Record<string, string> };

/** The type to announce: the browser's, or one guessed from the name when the browser gives none. */
function typeOf(file: File): string {
  if (file.type) return file.type;
  const ext = file.name.split('.').pop()?.toLowerCase();
  const byExt: Record<string, string> = { wav: 'audio/wav', mp3: 'audio/mpeg', ogg: 'audio/ogg', opus: 'audio/ogg', m4a: 'audio/mp4', jpg: 'image/jpeg', jpeg: 'image/jpeg', png: 'image/png', webp: 'image/webp', pdf: 'application/pdf' };
  return (ext && byExt[ext]) || 'application/octet-stream';
}

export function useUploads(caseId: string, onDone: () => void) {
  const [uploads, setUploads] = useState<UploadState[]>([]);
  const xhrs = useRef(new Map<string, XMLHttpRequest>());
  const patch = useCallback((key: string, p: Partial<UploadState>) => setUploads((list) => list.map((u) => (u.key === key ? { ...u, ...p } : u))), []);

  const run = useCallback(
    async (key: string, file: File) => {
      patch(key, { phase: 'asking', sent: 0, error: undefined });
      const ask = await callApi<Ticket>(`/api/cases/${caseId}/files`, { body: { name: file.name, size: file.size, contentType: typeOf(file) } });
      if (!ask.ok) return patch(key, { phase: 'failed', error: ask.error });
      patch(key, { phase: 'sending' });
      const sent = await new Promise<'ok' | 'cancelled' | string>((resolve) => {
        const xhr = new XMLHttpRequest();
        xhrs.current.set(key, xhr);
        xhr.open(ask.data.method, ask.data.uploadUrl);
        for (const [h, v] of Object.entries(ask.data.headers)) xhr.setRequestHeader(h, v);
        xhr.upload.onprogress = (e) => patch(key, { sent: e.loaded, total: e.lengthComputable ? e.total : file.size });
        xhr.onload = () => resolve(xhr.status >= 200 && xhr.status < 300 ? 'ok' : `The storage server answered ${xhr.status}.`);
        xhr.onerror = () => resolve('The connection to the storage server failed.');
        xhr.onabort = () => resolve('cancelled');
        xhr.send(file);
      });
      xhrs.current.delete(key);
      if (sent === 'cancelled') return patch(key, { phase: 'cancelled' });
      if (sent !== 'ok') return patch(key, { phase: 'failed', error: sent });
      patch(key, { phase: 'checking', sent: file.size });
      const done = await callApi(`/api/cases/${caseId}/files/${ask.data.fileId}/complete`, { body: {} });
      if (!done.ok) return patch(key, { phase: 'failed', error: done.error });
      patch(key, { phase: 'done' });
      onDone();
    },
    [caseId, onDone, patch],
  );

  const add = useCallback(
    (files: FileList | File[]) => {
      for (const file of Array.from(files)) {
        const key = `${file.name}-${file.size}-${Math.random().toString(36).slice(2)}`;
        setUploads((list) => [...list, { key, file, phase: 'asking', sent: 0, total: file.size }]);
        void run(key, file);
      }
    },
    [run],
  );
  const cancel = useCallback((key: string) => xhrs.current.get(key)?.abort(), []);
  const retry = useCallback((key: string) => {
    const u = uploads.find((x) => x.key === key);
    if (u) void run(key, u.file);
  }, [uploads, run]);
  const dismiss = useCallback((key: string) => setUploads((list) => list.filter((u) => u.key !== key)), []);
  return { uploads, add, cancel, retry, dismiss };
}
