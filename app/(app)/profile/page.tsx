import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { ProfileForm } from './profile-form';
import { ChangePasswordForm } from './change-password-form';

export const metadata: Metadata = { title: 'Your profile' };

export default async function ProfilePage() {
  await requirePageUser();
  return (
    <div className="mx-auto max-w-xl space-y-4">
      <h1 className="text-2xl font-extrabold">Your profile</h1>
      <p className="text-ink-soft">Your name and call sign, and the loop and receiver you hunt with: Quietfix uses them to read your bearings and levels correctly.</p>
      <ProfileForm />
      <ChangePasswordForm />
    </div>
  );
}
