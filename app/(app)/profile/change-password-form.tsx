'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { changePasswordSchema, type ChangePasswordInput } from '@/lib/validation/users';
import { callApi } from '@/lib/api/client';
import { applyServerIssues } from '@/lib/api/apply-server-issues';
import { TextField } from '@/components/ui/text-field';
import { NewPasswordFields } from '@/components/ui/new-password-fields';
import { NoticeBox } from '@/components/ui/notice-box';

const FIELDS = ['current', 'password', 'confirm'];

/** Changing the password ends every session of the account, this one too: then sign in again. */
export function ChangePasswordForm() {
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ChangePasswordInput>({ resolver: zodResolver(changePasswordSchema) });

  async function onSubmit(values: ChangePasswordInput) {
    setProblem(null);
    const r = await callApi<{ message: string }>('/api/password/change', { body: values });
    if (r.ok) {
      window.location.assign('/sign-in?next=%2Fprofile');
      return;
    }
    const rest = applyServerIssues(r.issues, setError, (p) => FIELDS.includes(p));
    setProblem(rest.length || !r.issues?.length ? [r.error, ...rest].join(' ') : null);
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate aria-labelledby="change-password">
      <h2 id="change-password" className="text-lg font-bold">
        Change your password
      </h2>
      <p className="text-ink-soft">Every device signed in to your account is signed out, this one too; then sign in with the new password.</p>
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <TextField id="current" label="Current password" type="password" autoComplete="current-password" error={formState.errors.current} registration={register('current')} />
      <NewPasswordFields password={register('password')} confirm={register('confirm')} errors={formState.errors} />
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Change password
      </button>
    </form>
  );
}
