import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getClubSettings } from '@/db/settings';
import { createInvitation } from '@/lib/auth/tokens';
import { inviteSchema } from '@/lib/validation/users';
import { invitationMail } from '@/lib/mail/account-messages';
import { sendMail } from '@/lib/mail/send';
import { forbidden, AppError } from '@/lib/errors';

/**
 * Admins invite anyone; coordinators invite hunters and members. The invitation is
 * stored first, then mailed; if the mail server refuses, nothing is kept and the
 * coordinator is told to try again.
 */
export const POST = route(async (req) => {
  const me = await requireUser('admin', 'coordinator');
  const input = inviteSchema.parse(await readJson(req));
  if (me.role === 'coordinator' && (input.role === 'admin' || input.role === 'coordinator')) {
    throw forbidden('Coordinators can invite hunters and members; ask an admin for other roles.');
  }
  const club = await getClubSettings();
  await inTransaction(async (trx) => {
    const token = await createInvitation(trx, { ...input, createdBy: me.id });
    const mail = invitationMail({ name: input.name, clubName: club.clubName, inviterName: me.name, role: input.role, token });
    try {
      await sendMail({ to: input.email, subject: mail.subject, text: mail.text, html: mail.html });
    } catch (err) {
      console.error('[quietfix] invitation mail failed:', (err as Error).message);
      throw new AppError(502, 'The mail server did not accept the invitation; nothing was saved. Try again in a moment.');
    }
  });
  return json({ ok: true, email: input.email }, 201);
});
