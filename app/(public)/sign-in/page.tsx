import type { Metadata } from 'next';
import { Suspense } from 'react';
import { SignInForm } from './sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default function SignInPage() {
  return (
    <div className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-extrabold">Sign in</h1>
      <Suspense>
        <SignInForm />
      </Suspense>
    </div>
  );
}
