'use client';

import { useState } from 'react';
import Link from 'next/link';
import { callApi } from '@/lib/api/client';
import { NoticeBox } from '@/components/ui/notice-box';
import { ChoiceButtons } from './choice-buttons';
import { formatLatLon } from './format-position';
import type { Doors } from './use-doors';

const HOW = [
  { value: 'level-peak', label: 'Level peaked', detail: 'walking past on public ground' },
  { value: 'switch-off-test', label: 'Switch-off test', detail: 'the owner agreed to it' },
  { value: 'other', label: 'Other', detail: 'say how in the note' },
] as const;
type How = (typeof HOW)[number]['value'];
const HOW_LABEL: Record<How, string> = { 'level-peak': 'the level peaked there', 'switch-off-test': 'a switch-off test the owner agreed to', other: 'another way' };

/** How many candidates show before "show all". */
const SHORT_LIST = 6;

/**
 * From the fix to a door: the buildings inside the 95 % region (most likely first), the cautions
 * beside them, and (for the hunter) confirming the premises found on foot.
 * `point` is a position tapped on the map, for premises that are not in the places layer.
 */
export function DoorsSection({ doors, canConfirm, point, onConfirmed }: { doors: Doors; canConfirm: boolean; point?: { lat: number; lon: number } | null; onConfirmed?: () => void }) {
  const [all, setAll] = useState(false);
  const { candidates, premises, target } = doors;
  const inside = candidates?.insideCount ?? 0;
  const items = candidates?.items ?? [];
  const shown = all ? items : items.slice(0, SHORT_LIST);
  return (
    <section className="space-y-3 border-t border-ink/10 pt-3" aria-labelledby="doors-heading" data-testid="doors">
      <h3 id="doors-heading" className="font-bold">
        {candidates?.region ? (inside === 1 ? '1 house inside the region' : `${inside} houses inside the region`) : 'Houses inside the region'}
      </h3>
      <p className="rounded-md border-l-4 border-l-flare-500 bg-flare-100 px-3 py-2 text-sm text-ink" data-testid="doors-caution">
        These are places to listen more closely from public ground, not an accusation: the noise may come from next door, a street light or a
        power pole. Never enter gardens or driveways, never touch utility hardware, never confront anyone. <Link href="/cautions">Cautions</Link>
      </p>
      {doors.candidatesError && <p className="text-alarm-600">The houses could not be loaded: {doors.candidatesError.message}</p>}
      {!candidates?.region && !doors.candidatesError && <p className="text-ink-soft">There is no fix yet, so no region to list houses from.</p>}
      {candidates?.region && items.length === 0 && <p className="text-ink-soft">No buildings from the club’s places layer are in or near the region.</p>}
      {candidates?.truncated && (
        <p className="text-sm text-ink-soft" data-testid="candidates-truncated">
          The {items.length} most likely are listed; more bearings from other sides will narrow the region.
        </p>
      )}
      {shown.length > 0 && (
        <ol className="divide-y divide-ink/10 rounded-lg border border-ink/15" aria-label="Houses, most likely first" data-testid="candidate-list">
          {shown.map((c) => (
            <li key={c.placeId} className="flex flex-wrap items-center gap-2 px-3 py-2" data-testid="candidate">
              <div className="min-w-0 flex-1">
                <p className="font-semibold break-words">{c.address ?? 'Building without an address'}</p>
                <p className="text-xs text-ink-soft">
                  {c.insideRegion ? 'inside the region' : 'just outside the region'} · relative likelihood {Math.round(c.likelihood * 100)} %
                </p>
              </div>
              <button type="button" className="btn-quiet text-sm" onClick={() => doors.show(c)}>
                Show on map
              </button>
              {canConfirm && (
                <button type="button" className="btn-quiet text-sm" onClick={() => doors.pick(c)}>
                  Confirmed here…
                </button>
              )}
            </li>
          ))}
        </ol>
      )}
      {items.length > SHORT_LIST && (
        <button type="button" className="btn-quiet text-sm" onClick={() => setAll(!all)}>
          {all ? 'Show fewer' : `Show all ${items.length}`}
        </button>
      )}
      {premises && (
        <div className="card border-l-4 border-l-alarm-600" data-testid="premises">
          <p className="text-sm text-ink-soft">Confirmed premises</p>
          <p className="font-bold break-words">{premises.address}</p>
          <p className="text-sm text-ink-soft">
            {HOW_LABEL[premises.how]}, by {premises.confirmedBy?.name ?? 'a former member'} on {new Date(premises.confirmedAt).toLocaleDateString()}
            {premises.note ? ` — ${premises.note}` : ''}
          </p>
        </div>
      )}
      {canConfirm && !target && (
        <button
          type="button"
          className="btn-quiet text-sm"
          onClick={() => doors.setTarget({ placeId: null, address: '', lat: point?.lat ?? null, lon: point?.lon ?? null })}
        >
          Premises not in the list…
        </button>
      )}
      {canConfirm && target && <PremisesForm caseId={doors.caseId} doors={doors} point={point} onDone={onConfirmed} />}
    </section>
  );
}

function PremisesForm({ caseId, doors, point, onDone }: { caseId: string; doors: Doors; point?: { lat: number; lon: number } | null; onDone?: () => void }) {
  const target = doors.target!;
  const [address, setAddress] = useState(target.address);
  const [how, setHow] = useState<How | undefined>(undefined);
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const at = target.placeId ? null : (point ?? (target.lat !== null && target.lon !== null ? { lat: target.lat, lon: target.lon } : null));

  async function save() {
    setBusy(true);
    setProblem(null);
    const body = target.placeId ? { placeId: target.placeId, address: address || undefined, how, note } : { address, lat: at?.lat, lon: at?.lon, how, note };
    const r = await callApi(`/api/cases/${caseId}/premises`, { method: 'PUT', body });
    setBusy(false);
    if (!r.ok) return setProblem([r.error, ...(r.issues ?? []).map((i) => i.message)].join(' '));
    doors.setTarget(null);
    await doors.refreshPremises();
    onDone?.();
  }

  return (
    <form
      className="card space-y-3"
      aria-label="Confirm the premises"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <p className="font-bold">Confirm the premises</p>
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <div>
        <label htmlFor="premises-address" className="label">
          Address
        </label>
        <input id="premises-address" className="field" value={address} onChange={(e) => setAddress(e.target.value)} maxLength={300} autoComplete="off" />
        <p className="mt-1 text-sm text-ink-soft">
          {target.placeId
            ? 'The building you picked; correct the address if it is incomplete.'
            : at
              ? `At ${formatLatLon(at.lat, at.lon)} (the point tapped on the map).`
              : 'Tap the map where the premises are, then type the address.'}
        </p>
      </div>
      <ChoiceButtons legend="How did you confirm it?" name="premises-how" options={HOW} value={how} onChange={setHow} />
      <div>
        <label htmlFor="premises-note" className="label">
          Note (optional)
        </label>
        <textarea id="premises-note" rows={2} className="field" value={note} maxLength={1000} onChange={(e) => setNote(e.target.value)} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>
          Save the premises
        </button>
        <button type="button" className="btn-quiet" onClick={() => doors.setTarget(null)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
