import type { Knex } from 'knex';
import { insertOutbox, type OutboxRow } from '@/db/outbox';
import { getUserToken } from '@/db/user-tokens';
import type { AccountMail } from '@/lib/mail/account-messages';
import { messageIdDomain } from '@/lib/notices/config';
import { accountLink, deriveAccountToken } from './account-link';

/**
 * Invitation and reset e-mails go through the outbox like notices (lib/notices/README.md): the
 * request stores the link row and an outbox row in one transaction and answers at once; the
 * worker delivers with retries, so a mail server outage loses none and the request's answer
 * does not wait for SMTP. The stored text holds a stand-in where the link goes; the worker puts
 * the real link in at send time (derived from the row's nonce and the server secret), so no
 * working link is ever written to the database.
 */
export const LINK_SLOT = '{{quietfix-account-link}}';

/** Thrown when the link behind a queued e-mail was used, retired or expired: sending it would help no one. */
export class RetiredLinkError extends Error {
  constructor() {
    super('the link in this e-mail was used, replaced or expired before it could be sent');
    this.name = 'RetiredLinkError';
  }
}

export async function queueAccountMail(trx: Knex, p: { tokenId: string; to: string; mail: (link: string) => AccountMail }): Promise<OutboxRow> {
  const m = p.mail(LINK_SLOT);
  return insertOutbox(trx, {
    kind: 'account',
    noticeId: null,
    caseId: null,
    userTokenId: p.tokenId,
    idempotencyKey: `account:${p.tokenId}`,
    messageId: `<account-${p.tokenId}@${messageIdDomain()}>`,
    toAddress: p.to,
    subject: m.subject,
    textBody: m.text,
    htmlBody: m.html,
  });
}

/** The e-mail to send for an account row, with its real link; RetiredLinkError when the link is no longer open. */
export async function composeAccountMail(q: Knex, row: OutboxRow): Promise<{ subject: string; text: string; html?: string }> {
  const t = row.userTokenId ? await getUserToken(row.userTokenId, q) : undefined;
  if (!t || t.usedAt || !t.nonce || new Date(t.expiresAt).getTime() <= Date.now()) throw new RetiredLinkError();
  const link = accountLink(deriveAccountToken(t.id, t.nonce));
  const put = (s: string | null) => (s ?? '').replaceAll(LINK_SLOT, link);
  return { subject: row.subject ?? '', text: put(row.textBody), html: row.htmlBody ? put(row.htmlBody) : undefined };
}
