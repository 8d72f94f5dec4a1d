'use client';

import { changePasswordSchema } from '@/lib/validation/users';
import { useApiForm } from '@/lib/api/use-api-form';
import { TextField } from '@/components/ui/text-field';
import { NewPasswordFields } from '@/components/ui/new-password-fields';
import { FormProblemBox } from '@/components/ui/form-problem';

/** Changing the password ends every session of the account, this one too: then sign in again. */
export function ChangePasswordForm() {
  const { form, submit, problem, pending } = useApiForm<typeof changePasswordSchema, { message: string }>(changePasswordSchema, {
    defaultValues: { current: '', password: '', confirm: '' },
    request: () => ({ url: '/api/password/change' }),
    onSuccess: () => window.location.assign('/sign-in?next=%2Fprofile'),
  });
  const { register, formState } = form;

  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-labelledby="change-password">
      <h2 id="change-password" className="text-lg font-bold">
        Change your password
      </h2>
      <p className="text-ink-soft">Every device signed in to your account is signed out, this one too; then sign in with the new password.</p>
      <FormProblemBox problem={problem} />
      <TextField id="current" label="Current password" type="password" autoComplete="current-password" error={formState.errors.current} registration={register('current')} />
      <NewPasswordFields password={register('password')} confirm={register('confirm')} errors={formState.errors} />
      <button type="submit" className="btn-primary" disabled={pending}>
        Change password
      </button>
    </form>
  );
}
