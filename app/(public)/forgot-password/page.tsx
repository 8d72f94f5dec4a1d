'use client';

import { useState } from 'react';
import { forgotPasswordSchema } from '@/lib/validation/users';
import { useApiForm } from '@/lib/api/use-api-form';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { FormProblemBox } from '@/components/ui/form-problem';

export default function ForgotPasswordPage() {
  const [sent, setSent] = useState<string | null>(null);
  const { form, submit, problem, pending } = useApiForm<typeof forgotPasswordSchema, { message: string }>(forgotPasswordSchema, {
    defaultValues: { email: '' },
    request: () => ({ url: '/api/password/forgot' }),
    onSuccess: (data) => setSent(data.message),
  });
  const { register, formState } = form;
  return (
    <div className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-extrabold">Forgot your password?</h1>
      <form onSubmit={(e) => (setSent(null), submit(e))} className="card space-y-4" noValidate>
        {sent && <NoticeBox tone="info">{sent}</NoticeBox>}
        <FormProblemBox problem={problem} />
        <TextField id="email" label="Your e-mail" type="email" autoComplete="username" error={formState.errors.email} registration={register('email')} />
        <button type="submit" className="btn-primary w-full" disabled={pending}>
          Send me a link
        </button>
      </form>
    </div>
  );
}
