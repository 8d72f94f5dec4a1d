import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticesAtAddressElsewhere } from '@/db/notices';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { editDraft, noticeAccess } from '@/lib/notices/service';
import { noticePatchSchema } from '@/lib/validation/notices';

/** One notice; the household's details and the other-case warning for the committee only. */
export const GET = route<{ id: string; noticeId: string }>(async (_req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'read');
  const elsewhere = noticeAccess(me, c).contact ? { sameAddressElsewhere: await noticesAtAddressElsewhere(me, n.addressKey, c.id) } : {};
  return json({ notice: await noticeView(me, c, n.id), ...elsewhere });
});

/** Edits a draft; `version` must be the one loaded (409 otherwise). */
export const PATCH = route<{ id: string; noticeId: string }>(async (req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'draft');
  const input = noticePatchSchema.parse(await readJson(req));
  await inTransaction((trx) => editDraft(trx, me, c.id, n.id, input));
  return json({ notice: await noticeView(me, c, n.id) });
});
