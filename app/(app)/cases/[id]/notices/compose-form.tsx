'use client';

import { useEffect, useState } from 'react';
import useSWR from 'swr';
import { callApi, fetchJson } from '@/lib/api/client';
import type { Premises } from '@/db/premises';
import { useApiForm } from '@/lib/api/use-api-form';
import { FormProblemBox } from '@/components/ui/form-problem';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { TEMPLATE_KEYS, TEMPLATE_TITLES } from '@/lib/notices/templates';
import { noticeCreateSchema } from '@/lib/validation/notices';
import type { NoticeView } from '@/lib/notices/views';

type Elsewhere = { caseId: string; reference: string; title: string; status: string }[];

export function ComposeForm({ caseId, onCreated }: { caseId: string; onCreated: (id: string) => void }) {
  const [elsewhere, setElsewhere] = useState<Elsewhere>([]);
  const { form, submit, problem, pending } = useApiForm<typeof noticeCreateSchema, { notice: NoticeView }>(noticeCreateSchema, {
    defaultValues: { templateKey: 'first-notice', recipientName: 'The householder', postalAddress: '', email: '', personalNote: '' },
    request: () => ({ url: `/api/cases/${caseId}/notices` }),
    onSuccess: (data) => {
      form.reset();
      onCreated(data.notice.id);
    },
  });
  const { register, formState, watch, getValues, setValue } = form;
  const address = watch('postalAddress');
  // The confirmed premises pre-fill the address (one line per part); it stays editable.
  const premises = useSWR<{ premises: Premises | null }>(`/api/cases/${caseId}/premises`, fetchJson).data?.premises;
  useEffect(() => {
    if (premises && !getValues('postalAddress')) setValue('postalAddress', premises.address.split(', ').join('\n'));
  }, [premises, getValues, setValue]);

  // Warn while typing when the same household already has an open notice on another case.
  useEffect(() => {
    if (!address || address.trim().length < 5) return setElsewhere([]);
    const t = setTimeout(async () => {
      const r = await callApi<{ sameAddressElsewhere?: Elsewhere }>(`/api/cases/${caseId}/notices?address=${encodeURIComponent(address)}`);
      if (r.ok) setElsewhere(r.data.sameAddressElsewhere ?? []);
    }, 400);
    return () => clearTimeout(t);
  }, [address, caseId]);


  const e = formState.errors;
  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <FormProblemBox problem={problem} />
      <div>
        <label htmlFor="notice-template" className="label">
          Kind of notice
        </label>
        <select id="notice-template" className="field" {...register('templateKey')}>
          {TEMPLATE_KEYS.map((k) => (
            <option key={k} value={k}>
              {TEMPLATE_TITLES[k]}
            </option>
          ))}
        </select>
      </div>
      <TextField id="notice-name" label="Recipient name" error={e.recipientName} registration={register('recipientName')} autoComplete="off" />
      <div>
        <label htmlFor="notice-address" className="label">
          Postal address
        </label>
        {premises && <p className="text-sm text-ink-soft">From the premises confirmed on foot; edit it if the letter needs more.</p>}
        <textarea id="notice-address" rows={3} className="field" aria-invalid={!!e.postalAddress} aria-describedby="notice-address-error" {...register('postalAddress')} />
        {e.postalAddress && (
          <p id="notice-address-error" className="mt-1 text-sm font-semibold text-alarm-600">
            {e.postalAddress.message}
          </p>
        )}
      </div>
      {elsewhere.length > 0 && (
        <NoticeBox tone="warn" title="This household already has a notice on another case">
          {elsewhere.map((x) => `${x.reference} (${x.title}, ${x.status})`).join('; ')}. One calm letter is better than several: consider merging the cases or
          waiting.
        </NoticeBox>
      )}
      <TextField id="notice-email" type="email" label="E-mail (optional)" hint="Without one, print the letter and deliver it by hand." error={e.email} registration={register('email')} />
      <div>
        <label htmlFor="notice-note" className="label">
          Personal note (optional)
        </label>
        <textarea id="notice-note" rows={3} className="field" aria-invalid={!!e.personalNote} {...register('personalNote')} />
        {e.personalNote && <p className="mt-1 text-sm font-semibold text-alarm-600">{e.personalNote.message}</p>}
      </div>
      <button type="submit" className="btn-primary w-full sm:w-auto" disabled={pending}>
        Save draft
      </button>
    </form>
  );
}
