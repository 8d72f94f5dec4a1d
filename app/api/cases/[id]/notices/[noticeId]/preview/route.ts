import { route, json } from '@/lib/api/handler';
import { db } from '@/db';
import { noticeForRequest } from '@/lib/notices/request';
import { renderCurrent } from '@/lib/notices/values';

/** The notice as e-mail: subject, plain text and HTML (frozen once approved, live before); committee only: it names the household and carries the link. */
export const GET = route<{ id: string; noticeId: string }>(async (_req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'contact');
  const m = await renderCurrent(db, c, n, me.name);
  return json({ subject: m.subject, text: m.text, html: m.fullHtml, frozen: !!n.frozen });
});
