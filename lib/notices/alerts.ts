import type { Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { insertOutbox } from '@/db/outbox';
import { getClubSettings } from '@/db/settings';
import { activeCoordinatorEmails } from '@/db/notices';
import { messageIdDomain } from './config';
import { renderNotice, wrapHtml } from './render';

/** Who hears about answers and reminders: the active coordinators and the club's contact address. */
async function alertRecipients(q: Knex): Promise<{ email: string; clubName: string }[]> {
  const club = await getClubSettings(q);
  const people = await activeCoordinatorEmails(q);
  const all = new Set<string>([...people, ...(club.contactEmail ? [club.contactEmail] : [])].map((e) => e.toLowerCase()));
  return [...all].map((email) => ({ email, clubName: club.clubName }));
}

/**
 * Queues an alert e-mail to the committee in the caller's transaction. The text is stored
 * rendered (it holds no secret), one outbox row per address; `key` makes it happen once.
 */
export async function queueCommitteeAlert(trx: Knex, a: { key: string; caseId: string; subject: string; lines: string[] }): Promise<number> {
  const recipients = await alertRecipients(trx);
  // Same text and HTML rules as notices; the lines are data, so they go in as escaped values.
  const body = a.lines.map((_, i) => `{{l${i}}}`).join('\n\n');
  const values = Object.fromEntries(a.lines.map((l, i) => [`l${i}`, l]));
  const r = renderNotice({ subject: '{{s}}', body }, { ...values, s: a.subject });
  for (const to of recipients) {
    await insertOutbox(trx, {
      kind: 'alert',
      noticeId: null,
      caseId: a.caseId,
      idempotencyKey: `${a.key}:${to.email}`,
      messageId: `<alert-${randomUUID()}@${messageIdDomain()}>`,
      toAddress: to.email,
      subject: r.subject,
      textBody: r.text,
      htmlBody: wrapHtml(r.html, to.clubName),
    });
  }
  return recipients.length;
}
