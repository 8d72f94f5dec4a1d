'use client';

import useSWR from 'swr';
import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { LOOP_SHAPES, profileSchema, type ProfileInput } from '@/lib/validation/profile';
import { fetchJson } from '@/lib/api/client';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import type { Profile } from '@/db/types';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { numberOrUndefined, plainMessage } from '@/components/ui/field-error';
import { ChoiceChip, NumberField, SelectField } from '@/components/ui/form-fields';
import { LoopSizeNote } from './loop-size-note';

const SHAPE_LABELS: Record<(typeof LOOP_SHAPES)[number], { shape: string; size: string }> = {
  circle: { shape: 'Circle', size: 'Diameter (m)' },
  square: { shape: 'Square', size: 'Side (m)' },
  octagon: { shape: 'Octagon', size: 'Side (m)' },
  other: { shape: 'Other shape', size: 'Circumference (m)' },
};
const REFERENCES = [
  { value: 'true', label: 'True north (map)' },
  { value: 'magnetic', label: 'Magnetic north (compass)' },
] as const;

const textOrNull = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? v : null);
const numberOrNull = (v: unknown) => numberOrUndefined(v) ?? null;

function toFormValues(p: Profile): ProfileInput {
  return {
    name: p.name,
    callSign: p.callSign,
    loopShape: (LOOP_SHAPES as readonly string[]).includes(p.loopShape ?? '') ? (p.loopShape as ProfileInput['loopShape']) : null,
    loopSizeM: p.loopSizeM,
    sMeterOffsetDb: p.sMeterOffsetDb,
    bearingReference: p.bearingReference,
  };
}

function Form({ profile, onSaved }: { profile: Profile; onSaved: (p: Profile) => void }) {
  const [saved, setSaved] = useState(false);
  const { form, submit, problem } = useApiForm<typeof profileSchema, Profile>(profileSchema, {
    defaultValues: toFormValues(profile),
    request: () => ({ url: '/api/profile', method: 'PATCH' }),
    onSuccess: (p) => {
      form.reset(toFormValues(p));
      onSaved(p);
      setSaved(true);
    },
  });
  const { register, formState, control } = form;
  const [shape, size] = useWatch({ control, name: ['loopShape', 'loopSizeM'] });
  const e = formState.errors;


  return (
    <form onSubmit={(ev) => (setSaved(false), submit(ev))} noValidate className="card space-y-5" data-testid="profile-form">
      {saved && <NoticeBox tone="info">Profile saved.</NoticeBox>}
      <FormProblemBox problem={problem} />
      <p className="text-sm text-ink-soft">
        Signed in as {profile.email} · {profile.role}
      </p>
      <TextField id="name" label="Name" autoComplete="name" error={e.name} registration={register('name')} />
      <TextField
        id="callSign"
        label="Call sign (optional)"
        autoCapitalize="characters"
        autoComplete="off"
        error={e.callSign}
        registration={register('callSign', { setValueAs: textOrNull })}
      />
      <fieldset className="space-y-3">
        <legend className="label text-base">Your loop</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            id="loopShape"
            label="Shape"
            placeholder="not given"
            options={LOOP_SHAPES.map((v) => ({ value: v, label: SHAPE_LABELS[v].shape }))}
            error={e.loopShape?.message}
            registration={register('loopShape', { setValueAs: textOrNull })}
          />
          <NumberField
            id="loopSizeM"
            label={shape ? SHAPE_LABELS[shape].size : 'Size (m)'}
            min={0}
            max={50}
            error={plainMessage(e.loopSizeM, 'Type the size in metres (up to 50).')}
            registration={register('loopSizeM', { setValueAs: numberOrNull })}
          />
        </div>
        <LoopSizeNote shape={shape} sizeM={size} />
      </fieldset>
      <NumberField
        id="sMeterOffsetDb"
        label="S-meter offset (dB)"
        className="max-w-xs"
        min={-40}
        max={40}
        hint="How many dB your S-meter reads high (+) or low (−) against a calibrated level. If it shows S9 for a −79 dBm signal, which should read S8, it reads 6 dB high: enter +6. Leave 0 if you have not checked it."
        error={plainMessage(e.sMeterOffsetDb, 'Type a number of dB between −40 and +40 (0 if you do not know).')}
        registration={register('sMeterOffsetDb', { setValueAs: numberOrUndefined })}
      />
      <fieldset>
        <legend className="label text-base">Bearings you type are from</legend>
        <div className="flex flex-wrap gap-2">
          {REFERENCES.map((r) => (
            <ChoiceChip key={r.value} value={r.value} {...register('bearingReference')}>
              {r.label}
            </ChoiceChip>
          ))}
        </div>
        <p className="mt-1 text-sm text-ink-soft">Magnetic bearings are turned into true ones with the declination for the place and date (World Magnetic Model).</p>
      </fieldset>
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Saving…' : 'Save profile'}
      </button>
    </form>
  );
}

/** The signed-in person's own profile, loaded from and saved to /api/profile. */
export function ProfileForm() {
  const { data, error, isLoading, mutate } = useSWR<Profile>('/api/profile', fetchJson, { revalidateOnFocus: false });
  if (error && !data) return <NoticeBox tone="error" title="Your profile could not be loaded">{error.message}</NoticeBox>;
  if (isLoading || !data)
    return (
      <div className="card h-64 animate-pulse bg-paper-deep" aria-busy="true">
        <p className="sr-only" role="status">
          Loading your profile…
        </p>
      </div>
    );
  return <Form profile={data} onSaved={(p) => void mutate(p, { revalidate: false })} />;
}
