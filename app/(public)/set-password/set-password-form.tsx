'use client';

import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useState } from 'react';
import { setPasswordSchema } from '@/lib/validation/users';
import { useApiForm } from '@/lib/api/use-api-form';
import { NewPasswordFields } from '@/components/ui/new-password-fields';
import { NoticeBox } from '@/components/ui/notice-box';
import { FormProblemBox } from '@/components/ui/form-problem';

export function SetPasswordForm() {
  const token = useSearchParams().get('token') ?? '';
  const [done, setDone] = useState<string | null>(null);
  const { form, submit, problem, pending } = useApiForm<typeof setPasswordSchema, { email: string }>(setPasswordSchema, {
    defaultValues: { token, password: '', confirm: '' },
    request: () => ({ url: '/api/password' }),
    onSuccess: (data) => setDone(data.email),
  });
  const { register, formState } = form;

  if (done)
    return (
      <NoticeBox title="Password saved">
        You can now <Link href="/sign-in">sign in</Link> as {done}.
      </NoticeBox>
    );
  if (!token) return <NoticeBox tone="error">This page needs the link from your e-mail.</NoticeBox>;

  return (
    <form onSubmit={submit} className="card space-y-4" noValidate>
      <FormProblemBox problem={problem} />
      <input type="hidden" {...register('token')} />
      <NewPasswordFields password={register('password')} confirm={register('confirm')} errors={formState.errors} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Save password
      </button>
    </form>
  );
}
