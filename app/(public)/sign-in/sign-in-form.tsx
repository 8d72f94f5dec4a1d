'use client';

import Link from 'next/link';
import { useRouter, useSearchParams } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signInSchema, type SignInInput } from '@/lib/validation/users';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { sameOriginPath } from '@/lib/api/same-origin-path';


export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  async function onSubmit(values: SignInInput) {
    setProblem(null);
    try {
      const { csrfToken } = await (await fetch('/api/auth/csrf')).json();
      const res = await fetch('/api/auth/callback/credentials', {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ csrfToken, email: values.email, password: values.password, json: 'true' }),
      });
      const body = await res.json().catch(() => ({}));
      if (res.status === 429) return setProblem(body.error ?? 'Too many failed sign-ins. Wait a while and try again.');
      if (!res.ok || (typeof body.url === 'string' && body.url.includes('error='))) {
        return setProblem('That e-mail and password do not match an active account.');
      }
      // Only a path on this site is followed after sign-in.
      router.replace(sameOriginPath(params.get('next'), window.location.origin, '/cases'));
      router.refresh();
    } catch {
      setProblem('Could not reach Quietfix. Check your connection and try again.');
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate>
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <TextField id="email" label="E-mail" type="email" autoComplete="username" error={formState.errors.email} registration={register('email')} />
      <TextField
        id="password"
        label="Password"
        type="password"
        autoComplete="current-password"
        error={formState.errors.password}
        registration={register('password')}
      />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </button>
      <p className="text-sm">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </form>
  );
}
