import type { Knex } from 'knex';
import { appendEvent, lockCase } from '@/db/cases';
import { activeNoticeAt, dueForReminder, insertNotice, lockNotice, markReminderChecked } from '@/db/notices';
import { getClubSettings } from '@/db/settings';
import { queueCommitteeAlert } from './alerts';
import { appUrl } from './config';

/**
 * Reminders: a first notice with no answer after the club's reminder_days gets a follow-up
 * draft (nothing is sent without a coordinator's approval) and the committee is told, once per
 * notice (reminder_checked_at, and a unique index on follow_up_of).
 */
export async function prepareReminders(q: Knex, limit = 20): Promise<number> {
  const due = await dueForReminder(q, (await getClubSettings(q)).reminderDays, limit);
  let prepared = 0;
  for (const d of due) {
    await q.transaction(async (trx) => {
      const c = await lockCase(trx, d.caseId);
      const n = await lockNotice(trx, d.id);
      if (!c || !n) return;
      if (!(await markReminderChecked(trx, n.id))) return; // another worker got here first
      if (await activeNoticeAt(trx, c.id, n.addressKey)) return; // someone already prepared one by hand
      const draft = await insertNotice(trx, {
        caseId: c.id,
        templateKey: 'follow-up',
        recipientName: n.recipientName,
        postalAddress: n.postalAddress,
        addressKey: n.addressKey,
        email: n.email,
        personalNote: '',
        createdBy: null,
        followUpOf: n.id,
      });
      await appendEvent(trx, { caseId: c.id, actorId: null, kind: 'follow-up-prepared', data: { noticeId: draft.id, followUpOf: n.id } });
      await queueCommitteeAlert(trx, {
        key: `reminder:${n.id}`,
        caseId: c.id,
        subject: `${c.reference}: no answer yet, a follow-up draft is ready`,
        lines: [
          `The notice to ${n.recipientName} (${c.reference}, "${c.title}") has had no answer since it went out.`,
          'Quietfix prepared a follow-up draft from the follow-up template. Nothing is sent until a coordinator approves it.',
          `Review it here: ${appUrl(`/cases/${c.id}/notices`)}`,
        ],
      });
      prepared++;
    });
  }
  return prepared;
}
