import type { Metadata } from 'next';
import { Suspense } from 'react';
import { SetPasswordForm } from './set-password-form';

export const metadata: Metadata = { title: 'Choose a password' };

export default function SetPasswordPage() {
  return (
    <div className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-extrabold">Choose a password</h1>
      <Suspense>
        <SetPasswordForm />
      </Suspense>
    </div>
  );
}
