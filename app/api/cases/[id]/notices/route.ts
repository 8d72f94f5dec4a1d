import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { noticesAtAddressElsewhere } from '@/db/notices';
import { noticesAtPremisesElsewhere } from '@/db/premises';
import { addressKey } from '@/lib/notices/address-key';
import { caseForNotices, noticeItems, noticeView } from '@/lib/notices/request';
import { createDraft, noticeAccess } from '@/lib/notices/service';
import { noticeCreateSchema } from '@/lib/validation/notices';
import { z } from 'zod';
import { safeText } from '@/lib/validation/text';

const listQuery = z.object({ address: safeText().max(400).optional() });

/**
 * The case's notices, newest first; the household's details only for the committee. `?address=`
 * also answers (committee only) which other unresolved cases already have a notice to that
 * household, so the composer can warn before a second letter. The assigned hunter gets neither:
 * `sameAddressElsewhere` is absent from their answer.
 */
export const GET = route<{ id: string }>(async (req, ctx) => {
  const { me, c } = await caseForNotices(ctx, 'read');
  const { address } = listQuery.parse(Object.fromEntries(req.nextUrl.searchParams));
  const can = noticeAccess(me, c);
  const items = await noticeItems(me, c);
  let elsewhere = {};
  if (can.contact) {
    const byAddress = address ? await noticesAtAddressElsewhere(me, addressKey(address), c.id) : [];
    // The same building (from the confirmed premises) counts as the same household whatever the spelling.
    const byPlace = (await noticesAtPremisesElsewhere(c.id)).filter((p) => !byAddress.some((a) => a.caseId === p.caseId));
    elsewhere = { sameAddressElsewhere: [...byAddress, ...byPlace] };
  }
  return json({ items, total: items.length, page: 1, pageSize: items.length, ...elsewhere, can, caseStatus: c.status, caseVersion: c.version });
});

/** A new draft (committee). 409 if the household already has one on this case. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { me, c } = await caseForNotices(ctx, 'draft');
  const input = noticeCreateSchema.parse(await readJson(req));
  const n = await inTransaction((trx) => createDraft(trx, me, c.id, input));
  const elsewhere = await noticesAtAddressElsewhere(me, n.addressKey, c.id);
  return json({ notice: await noticeView(me, c, n.id), sameAddressElsewhere: elsewhere }, 201);
});
