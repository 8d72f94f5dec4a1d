'use client';

import { useState } from 'react';
import { NoticeBox } from '@/components/ui/notice-box';
import { browserOffline, callApi } from '@/lib/api/client';
import { holdAfterFailedSend } from '@/lib/field/drain';
import { readingInputSchema } from '@/lib/validation/readings';
import { levelLabel, S_BUTTONS } from './level-words';
import type { WatchedPosition } from '@/components/ui/use-geolocation';
import type { FieldQueue } from './use-field-queue';

type Level = { unit: 'S' | 'dBm'; value: number };

export type WalkPanelProps = {
  caseId: string;
  queue: FieldQueue;
  position: WatchedPosition | null;
  positionError: string | null;
  /** a spot tapped on the map, used when the phone has no position */
  tapped: { lat: number; lon: number } | null;
  defaultFrequencyKhz?: number;
  onSaved: () => void;
};

/**
 * The walk to the door: one tap per level reading while walking the street. Position from the
 * phone (with its accuracy) or a spot tapped on the map, the level as S-units (quick buttons, as
 * read from a meter) or dBm, the frequency, and the time. Without a connection the reading waits
 * in the phone's queue like a bearing.
 */
export function WalkPanel({ caseId, queue, position, positionError, tapped, defaultFrequencyKhz, onSaved }: WalkPanelProps) {
  const [frequency, setFrequency] = useState(defaultFrequencyKhz ? String(defaultFrequencyKhz) : '');
  const [dbm, setDbm] = useState('');
  const [note, setNote] = useState<{ tone: 'info' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const where = position ? { lat: position.lat, lon: position.lon, accuracyM: position.accuracyM } : tapped ? { lat: tapped.lat, lon: tapped.lon, accuracyM: null } : null;

  const log = async (level: Level) => {
    if (!where) {
      setNote({ tone: 'error', text: positionError ?? 'Waiting for your position: or tap your spot on the map.' });
      return;
    }
    const f = Number(frequency.replace(',', '.'));
    const body = { clientId: crypto.randomUUID(), ...where, level, frequencyKhz: frequency.trim() && Number.isFinite(f) ? f : null, takenAt: new Date().toISOString() };
    const parsed = readingInputSchema.safeParse(body);
    if (!parsed.success) {
      setNote({ tone: 'error', text: parsed.error.issues.map((i) => i.message).join(' ') });
      return;
    }
    setBusy(true);
    const url = `/api/cases/${caseId}/readings`;
    const keep = async () => {
      await queue.hold(url, body);
      setNote({ tone: 'info', text: `${levelLabel(level)} kept on this phone (not yet sent).` });
    };
    try {
      if (browserOffline()) return await keep();
      const r = await callApi(url, { method: 'POST', body });
      if (r.ok) {
        setNote({ tone: 'info', text: `${levelLabel(level)} logged.` });
        onSaved();
      } else if (holdAfterFailedSend(r.status)) await keep();
      else setNote({ tone: 'error', text: r.error });
    } finally {
      setBusy(false);
    }
  };

  return (
    <section aria-label="Walk: level readings" className="card space-y-3" data-testid="walk-panel">
      <p className="text-sm">
        Walk the street on public ground and tap the level you read at each house front. Never enter a property; the peak is where to listen closely from the pavement.
      </p>
      <p className="text-base" data-testid="walk-position">
        {position
          ? `Your position: ±${Math.round(position.accuracyM)} m`
          : tapped
            ? 'Using the spot you tapped on the map.'
            : (positionError ?? 'Finding your position…')}
      </p>
      <label className="block">
        <span className="block font-semibold">Frequency (kHz)</span>
        <input className="field" inputMode="decimal" value={frequency} onChange={(e) => setFrequency(e.target.value)} aria-label="Walk frequency in kilohertz" />
      </label>
      <div className="grid grid-cols-4 gap-2" role="group" aria-label="Log the level in S-units">
        {S_BUTTONS.map((v) => (
          <button key={v} type="button" disabled={busy} className="btn-quiet min-h-12 px-1 text-lg font-bold tabular-nums" onClick={() => void log({ unit: 'S', value: Math.round(v * 1000) / 1000 })}>
            {levelLabel({ unit: 'S', value: v })}
          </button>
        ))}
      </div>
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const v = Number(dbm.replace(',', '.').replace('−', '-'));
          if (!dbm.trim() || !Number.isFinite(v)) return setNote({ tone: 'error', text: 'Type the level in dBm, e.g. -87.' });
          void log({ unit: 'dBm', value: v }).then(() => setDbm(''));
        }}
      >
        <label className="block flex-1">
          <span className="block font-semibold">Or the level in dBm</span>
          <input className="field" inputMode="decimal" value={dbm} onChange={(e) => setDbm(e.target.value)} placeholder="-87" />
        </label>
        <button type="submit" className="btn-primary min-h-12" disabled={busy}>
          Log dBm
        </button>
      </form>
      {note && <NoticeBox tone={note.tone}>{note.text}</NoticeBox>}
    </section>
  );
}
