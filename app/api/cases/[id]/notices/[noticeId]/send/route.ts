import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { queueSend } from '@/lib/notices/service';
import { noticeSendSchema } from '@/lib/validation/notices';

/**
 * Queues the approved notice for e-mail: notice state and outbox row in one transaction.
 * Idempotent: the same idempotencyKey (or a second click) answers with the same queued row.
 */
export const POST = route<{ id: string; noticeId: string }>(async (req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'decide');
  const { idempotencyKey } = noticeSendSchema.parse(await readJson(req));
  const { outbox, created } = await inTransaction((trx) => queueSend(trx, me, c.id, n.id, idempotencyKey));
  return json({ notice: await noticeView(me, c, n.id), messageId: outbox.messageId, alreadyQueued: !created }, created ? 202 : 200);
});
