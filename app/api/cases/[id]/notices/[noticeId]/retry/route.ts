import { route, json } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { retrySend } from '@/lib/notices/service';

/** Tries a failed e-mail again (same Message-ID, fresh tries). */
export const POST = route<{ id: string; noticeId: string }>(async (_req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'decide');
  await inTransaction((trx) => retrySend(trx, me, c.id, n.id));
  return json({ notice: await noticeView(me, c, n.id) }, 202);
});
