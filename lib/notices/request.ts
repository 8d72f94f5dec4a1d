import { z } from 'zod';
import type { RouteContext } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { getNotice, listNotices, type NoticeRow } from '@/db/notices';
import type { CaseRow, User } from '@/db/types';
import { notFound } from '@/lib/errors';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { noticeIdsSchema } from '@/lib/validation/notices';
import { noticeAccess, requireNoticeRight, type NoticeRight } from './service';
import { toNoticeItem, type NoticeItem } from './views';
import { safeText } from '@/lib/validation/text';

/**
 * The first steps of every notice handler, in the house order: params -> who is asking ->
 * may they see the case (404 if not) -> may they do this with its notices (403 if not).
 */
export async function caseForNotices(ctx: RouteContext<{ id: string }>, right: NoticeRight): Promise<{ me: User; c: CaseRow }> {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { row } = await loadVisibleCase(me, id);
  requireNoticeRight(me, row, right);
  return { me, c: row };
}

export async function noticeForRequest(
  ctx: RouteContext<{ id: string; noticeId: string }>,
  right: NoticeRight,
): Promise<{ me: User; c: CaseRow; n: NoticeRow }> {
  const { id, noticeId } = noticeIdsSchema.parse(await ctx.params);
  const me = await requireUser();
  const { row } = await loadVisibleCase(me, id);
  requireNoticeRight(me, row, right);
  const n = await getNotice(noticeId);
  if (!n || n.caseId !== id) throw notFound('No such notice on this case.');
  return { me, c: row, n };
}

/** The case's notices as this user may see them (the household's details for the committee only). */
export async function noticeItems(me: User, c: CaseRow): Promise<NoticeItem[]> {
  const contact = noticeAccess(me, c).contact;
  return (await listNotices(c.id)).map((n) => toNoticeItem(n, contact));
}

/** One notice as the list shows it to this user (fresh after a write). */
export async function noticeView(me: User, c: CaseRow, noticeId: string): Promise<NoticeItem> {
  const n = (await noticeItems(me, c)).find((x) => x.id === noticeId);
  if (!n) throw notFound('No such notice on this case.');
  return n;
}

export const tokenParamsSchema = z.object({ token: safeText().max(200) });

