import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { catcherInUse, listCaughtMail, type CaughtMail } from '@/lib/mail/catcher-client';
import { NoticeBox } from '@/components/ui/notice-box';

export const metadata: Metadata = { title: 'Caught mail' };

export default async function CaughtMailPage() {
  await requirePageUser('admin');
  if (!catcherInUse()) return <NoticeBox>Mail goes to a real relay; there is no local catcher to show.</NoticeBox>;
  let items: CaughtMail[] = [];
  let problem: string | null = null;
  try {
    items = (await listCaughtMail()).items;
  } catch (err) {
    problem = (err as Error).message;
  }
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Caught mail</h1>
      <p className="text-ink-soft">Messages the app sent while the local mail catcher stands in for a real mail server. Newest first.</p>
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      {!problem && items.length === 0 && <p className="card text-ink-soft">No messages yet.</p>}
      <ul className="space-y-3">
        {items.map((m) => (
          <li key={m.id} className="card">
            <details>
              <summary className="cursor-pointer">
                <span className="font-semibold">{m.subject || '(no subject)'}</span>
                <span className="block text-sm text-ink-soft">
                  to {m.to.join(', ')} · {new Date(m.receivedAt).toLocaleString('en-GB')}
                </span>
              </summary>
              <pre className="mt-3 whitespace-pre-wrap break-words rounded bg-paper-deep p-3 text-sm">{m.text}</pre>
            </details>
          </li>
        ))}
      </ul>
    </div>
  );
}
