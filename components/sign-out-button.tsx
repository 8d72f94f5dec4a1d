'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button type="button" className="btn-quiet min-h-12 px-3 py-1 text-sm" onClick={() => signOut({ callbackUrl: '/sign-in' })}>
      Sign out
    </button>
  );
}
