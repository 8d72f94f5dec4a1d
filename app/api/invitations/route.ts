import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getClubSettings } from '@/db/settings';
import { createInvitation } from '@/lib/auth/tokens';
import { inviteSchema } from '@/lib/validation/users';
import { forbidden } from '@/lib/errors';

/**
 * Admins invite anyone; coordinators invite hunters and members. The invitation and its e-mail
 * (an outbox row) are stored in one transaction; the outbox worker delivers it, with retries
 * while the mail server is away (lib/auth/account-mail.ts).
 */
export const POST = route(async (req) => {
  const me = await requireUser('admin', 'coordinator');
  const input = inviteSchema.parse(await readJson(req));
  if (me.role === 'coordinator' && (input.role === 'admin' || input.role === 'coordinator')) {
    throw forbidden('Coordinators can invite hunters and members; ask an admin for other roles.');
  }
  await inTransaction(async (trx) => {
    const club = await getClubSettings(trx);
    await createInvitation(trx, { ...input, createdBy: me.id, inviterName: me.name, clubName: club.clubName });
  });
  return json({ ok: true, email: input.email }, 201);
});
