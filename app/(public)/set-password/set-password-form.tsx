'use client';

import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { setPasswordSchema, type SetPasswordInput } from '@/lib/validation/users';
import { callApi } from '@/lib/api/client';
import { NewPasswordFields } from '@/components/ui/new-password-fields';
import { NoticeBox } from '@/components/ui/notice-box';

export function SetPasswordForm() {
  const token = useSearchParams().get('token') ?? '';
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SetPasswordInput>({
    resolver: zodResolver(setPasswordSchema),
    defaultValues: { token },
  });

  async function onSubmit(values: SetPasswordInput) {
    setProblem(null);
    const r = await callApi<{ email: string }>('/api/password', { body: values });
    if (r.ok) setDone(r.data.email);
    else setProblem(r.error);
  }

  if (done)
    return (
      <NoticeBox title="Password saved">
        You can now <Link href="/sign-in">sign in</Link> as {done}.
      </NoticeBox>
    );
  if (!token) return <NoticeBox tone="error">This page needs the link from your e-mail.</NoticeBox>;

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate>
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <input type="hidden" {...register('token')} />
      <NewPasswordFields password={register('password')} confirm={register('confirm')} errors={formState.errors} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        Save password
      </button>
    </form>
  );
}
