import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticesAtAddressElsewhere } from '@/db/notices';
import { noticeForRequest, noticeView } from '@/lib/notices/request';
import { editDraft } from '@/lib/notices/service';
import { noticePatchSchema } from '@/lib/validation/notices';

export const GET = route<{ id: string; noticeId: string }>(async (_req, ctx) => {
  const { c, n } = await noticeForRequest(ctx, 'read');
  return json({ notice: await noticeView(c.id, n.id), sameAddressElsewhere: await noticesAtAddressElsewhere(n.addressKey, c.id) });
});

/** Edits a draft; `version` must be the one loaded (409 otherwise). */
export const PATCH = route<{ id: string; noticeId: string }>(async (req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'draft');
  const input = noticePatchSchema.parse(await readJson(req));
  await inTransaction((trx) => editDraft(trx, me, c.id, n.id, input));
  return json({ notice: await noticeView(c.id, n.id) });
});
