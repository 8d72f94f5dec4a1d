'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { FormProvider } from 'react-hook-form';
import { reportSchema } from '@/lib/validation/cases';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import type { CaseDetail } from '@/lib/hunt/views';
import type { Role } from '@/db/types';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { TextAreaField } from '@/components/ui/form-fields';
import { SoundChoice } from './sound-choice';
import { FrequencyRows, emptyFrequency } from './frequency-rows';
import { LevelInput } from './level-input';
import { ScheduleInput } from './schedule-input';
import { PositionInput } from './position-input';

type Filed = { case: CaseDetail; possibleDuplicate: { id: string; reference: string; title: string } | null };

const COMMITTEE: Role[] = ['coordinator', 'admin'];
const FIELDS = ['title', 'sound', 'soundNote', 'description', 'frequencies', 'level', 'schedule', 'position', 'consentShareName'];

/** A member's noise report; on success opens the new case. */
export function ReportForm() {
  const router = useRouter();
  const [filed, setFiled] = useState<Filed | null>(null);
  const { form, submit, problem } = useApiForm<typeof reportSchema, Filed>(reportSchema, {
    request: () => ({ url: '/api/cases' }),
    onSuccess: (data) => {
      setFiled(data);
      router.push(`/cases/${data.case.id}?filed=1`);
    },
    fieldFor: (p) => (FIELDS.includes(p.split('.')[0]) ? p : null),
    defaultValues: {
      title: '',
      soundNote: '',
      description: '',
      frequencies: [emptyFrequency()],
      schedule: { days: [], pattern: 'intermittent', note: '' },
      consentShareName: false,
    },
  });
  const { register, formState } = form;

  if (filed)
    return (
      <NoticeBox title="Report filed">
        Your report is case {filed.case.reference}. Opening it…
        {filed.possibleDuplicate && COMMITTEE.includes(filed.case.viewerRole) && ` It may describe the same noise as ${filed.possibleDuplicate.reference} (${filed.possibleDuplicate.title}).`}
      </NoticeBox>
    );

  return (
    <FormProvider {...form}>
      <form onSubmit={submit} className="card space-y-6" noValidate aria-describedby={problem ? 'report-problem' : undefined}>
        {problem && (
          <div id="report-problem">
            <FormProblemBox problem={problem} />
          </div>
        )}
        <TextField id="title" label="Short title" placeholder="e.g. Buzz on 80 m most evenings" error={formState.errors.title} registration={register('title')} />
        <SoundChoice />
        <FrequencyRows />
        <LevelInput />
        <ScheduleInput />
        <PositionInput />
        <div>
          <label className="flex min-h-11 cursor-pointer items-start gap-3">
            <input type="checkbox" className="mt-1 h-5 w-5 shrink-0 accent-hush-700" aria-describedby="consent-hint" {...register('consentShareName')} />
            <span className="font-semibold">The committee may give my name to the neighbour</span>
          </label>
          <p id="consent-hint" className="ml-8 text-sm text-ink-soft">
            Leave this off and the letter will not say who reported the noise.
          </p>
        </div>
        <TextAreaField
          id="description"
          rows={4}
          label={
            <>
              Anything else the committee should know <span className="font-normal text-ink-soft">(optional)</span>
            </>
          }
          error={formState.errors.description?.message}
          registration={register('description')}
        />
        <NoticeBox tone="warn" title="Please leave the hunting to the committee">
          Do not go onto anyone’s property or confront a neighbour. The committee sends one polite letter; local law and your licensing regulator decide
          what counts as harmful interference.
        </NoticeBox>
        <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Sending…' : 'File the report'}
        </button>
      </form>
    </FormProvider>
  );
}
