'use client';

import { useState } from 'react';
import { NoticeBox } from '@/components/ui/notice-box';
import type { QueuedItem } from '@/lib/field/queue';
import { queuedItemLabel, waitingText } from './queue-words';
import type { FieldQueue } from './use-field-queue';

/** Fields a hunter may change on a refused item, per kind (dotted paths into the body). */
const EDITABLE: Record<QueuedItem['kind'], { path: string; label: string; numeric: boolean }[]> = {
  bearing: [
    { path: 'azimuthDeg', label: 'Azimuth (degrees)', numeric: true },
    { path: 'frequencyKhz', label: 'Frequency (kHz)', numeric: true },
    { path: 'note', label: 'Note', numeric: false },
  ],
  sweep: [
    { path: 'frequencyKhz', label: 'Frequency (kHz)', numeric: true },
    { path: 'note', label: 'Note', numeric: false },
  ],
  reading: [
    { path: 'level.value', label: 'Level (as read)', numeric: true },
    { path: 'frequencyKhz', label: 'Frequency (kHz)', numeric: true },
    { path: 'note', label: 'Note', numeric: false },
  ],
};

const getPath = (o: Record<string, unknown>, path: string): unknown => path.split('.').reduce<unknown>((v, k) => (v as Record<string, unknown> | undefined)?.[k], o);
function withPath(o: Record<string, unknown>, path: string, value: unknown): Record<string, unknown> {
  const [head, ...rest] = path.split('.');
  return { ...o, [head]: rest.length ? withPath((o[head] as Record<string, unknown>) ?? {}, rest.join('.'), value) : value };
}

function RefusedItem({ item, queue }: { item: QueuedItem; queue: FieldQueue }) {
  const [editing, setEditing] = useState(false);
  const [body, setBody] = useState(item.body);
  const fields = EDITABLE[item.kind];
  return (
    <li className="space-y-2 rounded-lg border-2 border-alarm-600 bg-alarm-100 p-3" data-testid="queue-refused">
      <p className="font-semibold">{queuedItemLabel(item)}</p>
      <p>
        <span className="font-semibold">Not accepted by the server:</span> <span data-testid="refusal-reason">{item.refusal?.message}</span>
        {item.refusal?.issues?.map((i) => (
          <span key={i.path} className="block">
            {i.path}: {i.message}
          </span>
        ))}
      </p>
      {editing ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            void queue.edit(item.clientId, body).then(() => setEditing(false));
          }}
        >
          {fields.map((f) => {
            const v = getPath(body, f.path);
            return (
              <label key={f.path} className="block">
                <span className="block text-sm font-semibold">{f.label}</span>
                <input
                  className="field"
                  inputMode={f.numeric ? 'decimal' : 'text'}
                  value={v === undefined || v === null ? '' : String(v)}
                  onChange={(e) => {
                    const raw = e.target.value;
                    const next = f.numeric ? (raw.trim() === '' ? undefined : Number(raw.replace(',', '.'))) : raw;
                    setBody(withPath(body, f.path, next));
                  }}
                />
              </label>
            );
          })}
          {item.kind !== 'reading' && (
            <label className="flex min-h-12 items-center gap-2">
              <input type="checkbox" className="h-6 w-6" checked={body.accuracyConfirmed === true} onChange={(e) => setBody({ ...body, accuracyConfirmed: e.target.checked })} />
              Use the position even if it is coarse
            </label>
          )}
          <div className="flex gap-2">
            <button type="submit" className="btn-primary min-h-12 flex-1">
              Send again
            </button>
            <button type="button" className="btn-quiet min-h-12" onClick={() => setEditing(false)}>
              Cancel
            </button>
          </div>
        </form>
      ) : (
        <div className="flex gap-2">
          <button type="button" className="btn-quiet min-h-12 flex-1" onClick={() => setEditing(true)}>
            Edit
          </button>
          <button type="button" className="btn-quiet min-h-12 flex-1" onClick={() => void queue.discard(item.clientId)}>
            Discard
          </button>
        </div>
      )}
    </li>
  );
}

/** What waits on this phone: the count ("2 waiting to send"), each item, and refused ones with the server's reason. */
export function QueuePanel({ queue }: { queue: FieldQueue }) {
  const { waiting, refused, online, last } = queue;
  if (!waiting.length && !refused.length && !last?.sent.length) return null;
  return (
    <section aria-label="Waiting on this phone" className="card space-y-2" data-testid="queue-panel">
      <div className="flex items-center justify-between gap-2">
        <p className="text-lg font-bold" data-testid="queue-count" aria-live="polite">
          {waitingText(waiting.length)}
        </p>
        {waiting.length > 0 && online && (
          <button type="button" className="btn-quiet min-h-12" onClick={() => void queue.flush()}>
            Send now
          </button>
        )}
      </div>
      {waiting.length > 0 && (
        <>
          <p className="text-ink-soft">{online ? 'Sending…' : 'No connection: kept on this phone, sent in order when the connection returns.'}</p>
          <ol className="list-decimal space-y-1 pl-6" data-testid="queue-waiting">
            {waiting.map((i) => (
              <li key={i.clientId}>{queuedItemLabel(i)}</li>
            ))}
          </ol>
        </>
      )}
      {refused.length > 0 && <ul className="space-y-2">{refused.map((i) => <RefusedItem key={i.clientId} item={i} queue={queue} />)}</ul>}
      {!waiting.length && !refused.length && last?.sent.length ? <NoticeBox tone="info">All sent: {last.sent.length} stored on the server.</NoticeBox> : null}
    </section>
  );
}
