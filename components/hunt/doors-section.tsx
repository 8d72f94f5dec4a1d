'use client';

import { useEffect, useState } from 'react';
import Link from 'next/link';
import { FieldError } from '@/components/ui/field-error';
import { FormProblemBox } from '@/components/ui/form-problem';
import { useApiForm } from '@/lib/api/use-api-form';
import { premisesSchema } from '@/lib/validation/places';
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
  const at = target.placeId ? null : (point ?? (target.lat !== null && target.lon !== null ? { lat: target.lat, lon: target.lon } : null));
  // The one form hook: the handler's schema checks in the browser, the server's issues land on
  // the address, the map point or the choice they name (a building that vanished goes to the form).
  const { form, submit, problem, pending } = useApiForm(premisesSchema, {
    defaultValues: { placeId: target.placeId ?? undefined, address: target.address, lat: at?.lat, lon: at?.lon, how: undefined, note: '' },
    request: (v) => ({
      url: `/api/cases/${caseId}/premises`,
      method: 'PUT',
      body: v.placeId ? { placeId: v.placeId, address: v.address || undefined, how: v.how, note: v.note } : { address: v.address, lat: v.lat, lon: v.lon, how: v.how, note: v.note },
    }),
    fieldFor: (path) => (path === 'lon' ? 'lat' : ['address', 'lat', 'how', 'note'].includes(path) ? path : null),
    onSuccess: async () => {
      doors.setTarget(null);
      await doors.refreshPremises();
      onDone?.();
    },
  });
  const { errors } = form.formState;
  // A tap on the map moves the point the form sends.
  useEffect(() => {
    form.setValue('lat', at?.lat);
    form.setValue('lon', at?.lon);
    if (at) form.clearErrors('lat');
  }, [at?.lat, at?.lon]); // eslint-disable-line react-hooks/exhaustive-deps -- the point's numbers, not the object
  const how = form.watch('how') as How | undefined;

  return (
    <form
      className="card space-y-3"
      aria-label="Confirm the premises"
      noValidate
      onSubmit={submit}
    >
      <p className="font-bold">Confirm the premises</p>
      <FormProblemBox problem={problem} />
      <div>
        <label htmlFor="premises-address" className="label">
          Address
        </label>
        <input
          id="premises-address"
          className="field"
          maxLength={300}
          autoComplete="off"
          aria-invalid={!!errors.address}
          aria-describedby={['premises-address-hint', errors.address ? 'premises-address-error' : '', errors.lat ? 'premises-point-error' : ''].filter(Boolean).join(' ')}
          {...form.register('address')}
        />
        <FieldError id="premises-address-error" message={errors.address?.message} />
        <p id="premises-address-hint" className="mt-1 text-sm text-ink-soft">
          {target.placeId
            ? 'The building you picked; correct the address if it is incomplete.'
            : at
              ? `At ${formatLatLon(at.lat, at.lon)} (the point tapped on the map).`
              : 'Tap the map where the premises are, then type the address.'}
        </p>
        <FieldError id="premises-point-error" message={errors.lat?.message} />
      </div>
      <div>
        <ChoiceButtons
          legend="How did you confirm it?"
          name="premises-how"
          options={HOW}
          value={how}
          onChange={(v) => form.setValue('how', v, { shouldValidate: form.formState.isSubmitted })}
        />
        <FieldError id="premises-how-error" message={errors.how?.message} />
      </div>
      <div>
        <label htmlFor="premises-note" className="label">
          Note (optional)
        </label>
        <textarea id="premises-note" rows={2} className="field" maxLength={1000} aria-invalid={!!errors.note} {...form.register('note')} />
        <FieldError id="premises-note-error" message={errors.note?.message} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={pending}>
          Save the premises
        </button>
        <button type="button" className="btn-quiet" onClick={() => doors.setTarget(null)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
