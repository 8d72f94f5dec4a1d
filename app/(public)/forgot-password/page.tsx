'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { forgotPasswordSchema } from '@/lib/validation/users';
import { callApi } from '@/lib/api/client';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';

type Input = z.input<typeof forgotPasswordSchema>;

export default function ForgotPasswordPage() {
  const [message, setMessage] = useState<{ tone: 'info' | 'error'; text: string } | null>(null);
  const { register, handleSubmit, formState } = useForm<Input>({ resolver: zodResolver(forgotPasswordSchema) });
  async function onSubmit(values: Input) {
    const r = await callApi<{ message: string }>('/api/password/forgot', { body: values });
    setMessage(r.ok ? { tone: 'info', text: r.data.message } : { tone: 'error', text: r.error });
  }
  return (
    <div className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-extrabold">Forgot your password?</h1>
      <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate>
        {message && <NoticeBox tone={message.tone}>{message.text}</NoticeBox>}
        <TextField id="email" label="Your e-mail" type="email" autoComplete="username" error={formState.errors.email} registration={register('email')} />
        <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
          Send me a link
        </button>
      </form>
    </div>
  );
}
