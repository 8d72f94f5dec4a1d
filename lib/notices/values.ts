import type { Knex } from 'knex';
import type { CaseRow } from '@/db/types';
import { firstNoticeDate, type FrozenNotice, type NoticeRow } from '@/db/notices';
import { casePeople } from '@/db/cases';
import { getClubSettings } from '@/db/settings';
import { getTemplate } from '@/db/templates';
import { appUrl, linkExpiry } from './config';
import { deriveToken } from './token';
import { renderNotice, wrapHtml, type Rendered } from './render';
import type { PlaceholderValues } from './templates';

export const longDate = (d: Date | string) =>
  new Date(d).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

export const responseLink = (token: string) => appUrl(`/r/${token}`);

/** Shown in previews before approval, when no link exists yet. */
export const LINK_NOT_YET = '(the private response link is made when the notice is approved)';

/**
 * The placeholder values for one notice, from the case, the club settings and the notice.
 * The reporter's name is filled only when the reporter agreed to share it.
 */
export async function buildValues(
  q: Knex,
  c: Pick<CaseRow, 'reference' | 'reporterId' | 'consentShareName'>,
  n: Pick<NoticeRow, 'recipientName' | 'personalNote' | 'followUpOf'>,
  p: { senderName: string; noticeDate: Date; expiresOn: Date | null },
): Promise<PlaceholderValues> {
  const club = await getClubSettings(q);
  const [reporter] = c.consentShareName ? await casePeople(q, [c.reporterId]) : [];
  const firstDate = n.followUpOf ? await firstNoticeDate(q, n.followUpOf) : null;
  return {
    recipientName: n.recipientName,
    clubName: club.clubName,
    clubContactEmail: club.contactEmail,
    caseReference: c.reference,
    senderName: p.senderName,
    personalNote: n.personalNote,
    reporterName: reporter?.name ?? '',
    noticeDate: longDate(p.noticeDate),
    expiresOn: p.expiresOn ? longDate(p.expiresOn) : '',
    firstNoticeDate: firstDate ? longDate(firstDate) : 'an earlier date',
  };
}

export type NoticeMessage = Rendered & { fullHtml: string; link: string | null; clubName: string; values: PlaceholderValues };

/** The approved notice as sent: its frozen texts and values, plus the derived response link. */
export function renderFrozen(n: Pick<NoticeRow, 'id' | 'tokenNonce'> & { frozen: FrozenNotice }): NoticeMessage {
  const link = n.tokenNonce ? responseLink(deriveToken(n.id, n.tokenNonce)) : null;
  const r = renderNotice(n.frozen, { ...n.frozen.values, responseLink: link ?? LINK_NOT_YET });
  const clubName = n.frozen.values.clubName ?? '';
  return { ...r, fullHtml: wrapHtml(r.html, clubName), link, clubName, values: n.frozen.values };
}

/** What the notice would say now: frozen if approved, else the current template and values. */
export async function renderCurrent(q: Knex, c: CaseRow, n: NoticeRow, senderName: string): Promise<NoticeMessage> {
  if (n.frozen) return renderFrozen({ ...n, frozen: n.frozen });
  const tpl = (await getTemplate(n.templateKey, q))!;
  const expires = linkExpiry();
  const values = await buildValues(q, c, n, { senderName, noticeDate: new Date(), expiresOn: expires });
  return renderFrozen({ id: n.id, tokenNonce: null, frozen: { subject: tpl.subject, body: tpl.body, values } });
}
