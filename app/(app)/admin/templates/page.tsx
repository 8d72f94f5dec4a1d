import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { listTemplates } from '@/db/templates';
import { PLACEHOLDERS } from '@/lib/notices/templates';
import { TemplateEditor } from './template-editor';

export const metadata: Metadata = { title: 'Letters' };
export const dynamic = 'force-dynamic';

export default async function TemplatesPage() {
  await requirePageUser('admin');
  const templates = (await listTemplates()).map((t) => ({ key: t.key, title: t.title, subject: t.subject, body: t.body, version: t.version }));
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Letters</h1>
      <p className="text-ink-soft">
        The texts of the club’s notices. Placeholders in double braces are filled from the case and the club settings, and anything they bring in
        is shown as plain text. Keep it calm: a device near them <em>may</em> be the source; the club offers help and has no authority.
      </p>
      <TemplateEditor templates={templates} placeholders={PLACEHOLDERS} />
    </div>
  );
}
