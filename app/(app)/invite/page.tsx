import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { InviteForm } from './invite-form';

export const metadata: Metadata = { title: 'Invite' };

export default async function InvitePage() {
  const me = await requirePageUser('admin', 'coordinator');
  const roles = me.role === 'admin' ? (['member', 'hunter', 'coordinator', 'admin'] as const) : (['member', 'hunter'] as const);
  return (
    <div className="max-w-md space-y-4">
      <h1 className="text-2xl font-extrabold">Invite someone</h1>
      <p className="text-ink-soft">They get an e-mail with a link to choose a password. The link works once and expires after 72 hours.</p>
      <InviteForm roles={[...roles]} />
    </div>
  );
}
