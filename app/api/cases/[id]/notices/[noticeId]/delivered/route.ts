import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { markDelivered } from '@/lib/notices/service';
import { noticeDeliveredSchema } from '@/lib/validation/notices';

/** Records a printed letter as delivered by hand; the first one moves the case to notified. */
export const POST = route<{ id: string; noticeId: string }>(async (req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'decide');
  const { deliveredOn } = noticeDeliveredSchema.parse(await readJson(req));
  await inTransaction((trx) => markDelivered(trx, me, c.id, n.id, deliveredOn));
  return json({ notice: await noticeView(me, c, n.id) });
});
