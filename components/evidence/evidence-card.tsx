'use client';

import { useCallback, useState } from 'react';
import useSWR from 'swr';
import { callApi, fetchJson } from '@/lib/api/client';
import type { FileView } from '@/lib/evidence/views';
import { SignatureView } from './signature-view';
import { UploadRow } from './upload-row';
import { useUploads } from './use-uploads';

const ACCEPT = 'audio/*,.wav,.mp3,.ogg,.opus,.m4a,image/jpeg,image/png,image/webp,application/pdf';

const STATUS_WORDS: Record<Exclude<NonNullable<FileView['analysis']>['status'], 'queued' | 'ready'>, string> = {
  refused: 'No signature:',
  'not-analysed': 'Not analysed:',
  failed: 'Analysis failed:',
};

function AnalysisLine({ f }: { f: FileView }) {
  const a = f.analysis;
  if (!a) return null;
  if (a.status === 'queued') return <p className="text-sm" role="status">Working out the audio signature…</p>;
  if (a.status !== 'ready')
    return (
      <p className="text-sm text-ink-soft" data-testid="analysis-status">
        <strong>{STATUS_WORDS[a.status]}</strong> {a.message}
      </p>
    );
  return (
    <div className="space-y-1" data-testid="analysis">
      <p className="text-sm">
        <strong>Signature:</strong> {a.mainsHz ? `mains family ${a.mainsHz} Hz (${a.mainsFamilyDb} dB)` : 'no mains family'}
        {'; '}
        {a.pulseRateHz ? `pulses at ${a.pulseRateHz} Hz` : 'no pulse train'}
        {'; '}
        {a.broadband ? 'broadband hiss' : 'no broadband hiss'}
      </p>
      <p className="text-sm text-ink-soft">{a.hint}</p>
    </div>
  );
}

function FileItem({ f, onDeleted }: { f: FileView; onDeleted: () => void }) {
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string>();
  const remove = async () => {
    if (!window.confirm(`Delete ${f.name}?`)) return;
    const r = await callApi(f.contentUrl.replace(/\/content$/, ''), { method: 'DELETE' });
    if (r.ok) onDeleted();
    else setProblem(r.error);
  };
  return (
    <li className="space-y-2 border-t border-ink/10 pt-2" data-testid="file-item">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <a href={f.contentUrl} className="min-w-0 truncate font-semibold">
          {f.name}
        </a>
        <span className="text-xs text-ink-faint">
          {(f.size / 1_000_000).toFixed(2)} MB · {f.uploadedBy.name ?? 'someone'} · {new Date(f.createdAt).toLocaleString()}
        </span>
      </div>
      {f.kind === 'photo' && f.thumbnailUrl && (
        // eslint-disable-next-line @next/next/no-img-element
        <img src={f.thumbnailUrl} alt={`Photo: ${f.name}`} className="max-h-40 rounded" />
      )}
      {f.kind === 'audio' && <audio controls preload="none" src={f.contentUrl} className="w-full" />}
      <AnalysisLine f={f} />
      {f.analysis?.status === 'ready' && (
        <button type="button" className="btn-quiet" onClick={() => setOpen((o) => !o)} aria-expanded={open}>
          {open ? 'Hide the spectrum' : 'Show the spectrum'}
        </button>
      )}
      {open && <SignatureView url={f.contentUrl.replace(/\/content$/, '')} />}
      {f.can.delete && (
        <button type="button" className="btn-quiet" onClick={remove}>
          Delete
        </button>
      )}
      {problem && <p className="text-sm text-alarm-600">{problem}</p>}
    </li>
  );
}

/** Recordings, photos and PDFs on a case: upload several with progress, see each and its signature. */
export function EvidenceCard({ caseId, canAdd }: { caseId: string; canAdd: boolean }) {
  const list = useSWR<{ items: FileView[] }>(`/api/cases/${caseId}/files`, fetchJson, {
    refreshInterval: (d) => (d?.items.some((f) => f.analysis?.status === 'queued' || (f.kind === 'photo' && !f.thumbnailUrl)) ? 1500 : 0),
  });
  const refresh = useCallback(() => void list.mutate(), [list]);
  const { uploads, add, cancel, retry, dismiss } = useUploads(caseId, refresh);
  const pick = (e: React.ChangeEvent<HTMLInputElement>) => {
    if (e.target.files?.length) add(e.target.files);
    e.target.value = '';
  };
  return (
    <section className="card min-w-0 space-y-3" aria-labelledby="evidence-heading" data-testid="evidence-card">
      <h2 id="evidence-heading" className="text-lg font-bold">
        Recordings and photos
      </h2>
      {canAdd && (
        <div className="flex flex-wrap gap-2">
          <label className="btn-quiet cursor-pointer">
            Attach files
            <input type="file" multiple accept={ACCEPT} className="sr-only" onChange={pick} data-testid="file-input" />
          </label>
          <label className="btn-quiet cursor-pointer">
            Record sound
            <input type="file" accept="audio/*" capture="user" className="sr-only" onChange={pick} />
          </label>
          <label className="btn-quiet cursor-pointer">
            Take a photo
            <input type="file" accept="image/*" capture="environment" className="sr-only" onChange={pick} />
          </label>
        </div>
      )}
      <p className="text-xs text-ink-faint">
        Recordings in WAV (PCM, 8–48 kHz), MP3 or OGG (Vorbis, Opus) get an audio signature of their first 60 s; M4A is kept but not analysed.
        Photos (JPEG, PNG, WebP) are shown to others without their location data.
      </p>
      {uploads.length > 0 && (
        <ul className="space-y-2">
          {uploads.map((u) => (
            <UploadRow key={u.key} u={u} onCancel={() => cancel(u.key)} onRetry={() => retry(u.key)} onDismiss={() => dismiss(u.key)} />
          ))}
        </ul>
      )}
      {list.error && <p className="text-sm text-alarm-600">{list.error.message}</p>}
      {list.data && !list.data.items.length && <p className="text-sm text-ink-faint">Nothing attached yet.</p>}
      {list.data && (
        <ul className="space-y-2">
          {list.data.items.map((f) => (
            <FileItem key={f.id} f={f} onDeleted={refresh} />
          ))}
        </ul>
      )}
    </section>
  );
}
