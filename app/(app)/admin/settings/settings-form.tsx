'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useApiForm } from '@/lib/api/use-api-form';
import { clubSettingsPatchSchema, NOISE_ENVIRONMENTS } from '@/lib/validation/settings';
import { FormProblemBox } from '@/components/ui/form-problem';
import { NumberField, SelectField } from '@/components/ui/form-fields';
import { TextField } from '@/components/ui/text-field';
import type { ClubSettings } from '@/db/types';

const ENVIRONMENT_WORDS: Record<(typeof NOISE_ENVIRONMENTS)[number], string> = {
  city: 'city (business areas)',
  residential: 'residential',
  rural: 'rural',
  'quiet-rural': 'quiet rural',
};

const num = { setValueAs: (v: string) => (v === '' ? undefined : Number(v)) };

/** The club's settings for admins; the server writes what changed to the settings timeline. */
export function SettingsForm({ settings }: { settings: ClubSettings }) {
  const router = useRouter();
  const [saved, setSaved] = useState<string | null>(null);
  const { form, submit, problem, pending } = useApiForm(clubSettingsPatchSchema, {
    defaultValues: settings,
    request: (values) => ({ url: '/api/settings', method: 'PATCH', body: values }),
    onSuccess: (data) => {
      const n = Object.keys((data as { changes: object }).changes).length;
      setSaved(n === 0 ? 'Nothing changed.' : `Saved ${n} ${n === 1 ? 'change' : 'changes'}.`);
      router.refresh();
    },
  });
  const { register, formState } = form;
  const e = formState.errors;
  return (
    <form onSubmit={submit} noValidate className="card grid gap-3 sm:grid-cols-2" aria-label="Club settings">
      <div className="sm:col-span-2">
        <FormProblemBox problem={problem} />
      </div>
      <TextField id="clubName" label="Club name" registration={register('clubName')} error={e.clubName} />
      <TextField id="contactEmail" label="Contact e-mail" type="email" registration={register('contactEmail')} error={e.contactEmail} />
      <NumberField id="locateThresholdM" label="Locate threshold (95 % ellipse semi-major, m)" registration={register('locateThresholdM', num)} error={e.locateThresholdM?.message} />
      <NumberField id="reminderDays" label="Reminder after (days)" registration={register('reminderDays', num)} error={e.reminderDays?.message} />
      <NumberField id="maxPositionAccuracyM" label="Position accuracy limit (m)" registration={register('maxPositionAccuracyM', num)} error={e.maxPositionAccuracyM?.message} />
      <NumberField id="uploadMaxMb" label="Upload size limit (MB)" registration={register('uploadMaxMb', num)} error={e.uploadMaxMb?.message} />
      <SelectField
        id="noiseEnvironment"
        label="Noise environment for the expected floor"
        hint="ITU-R P.372 man-made noise category of the club's area."
        registration={register('noiseEnvironment')}
        options={NOISE_ENVIRONMENTS.map((v) => ({ value: v, label: ENVIRONMENT_WORDS[v] }))}
        error={e.noiseEnvironment?.message}
      />
      <div className="flex items-end gap-3 sm:col-span-2">
        <button type="submit" className="btn-primary" disabled={pending}>
          {pending ? 'Saving…' : 'Save settings'}
        </button>
        {saved && <p role="status">{saved}</p>}
      </div>
    </form>
  );
}
