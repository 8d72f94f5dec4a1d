import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { approve } from '@/lib/notices/service';
import { noticeApproveSchema } from '@/lib/validation/notices';

/** A coordinator approves a draft: its text is frozen and its response link made. */
export const POST = route<{ id: string; noticeId: string }>(async (req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'decide');
  const { version } = noticeApproveSchema.parse(await readJson(req));
  await inTransaction((trx) => approve(trx, me, c.id, n.id, version));
  return json({ notice: await noticeView(me, c, n.id) });
});
