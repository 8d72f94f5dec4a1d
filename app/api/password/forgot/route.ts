import { route, json, readJson } from '@/lib/api/handler';
import { inTransaction } from '@/db';
import { getUserByEmail } from '@/db/users';
import { createPasswordReset } from '@/lib/auth/tokens';
import { forgotPasswordSchema } from '@/lib/validation/users';
import { passwordResetMail } from '@/lib/mail/account-messages';
import { sendMail } from '@/lib/mail/send';

/** Always the same answer, so the form does not reveal who has an account. */
export const POST = route(async (req) => {
  const { email } = forgotPasswordSchema.parse(await readJson(req));
  const user = await getUserByEmail(email);
  if (user?.active) {
    try {
      await inTransaction(async (trx) => {
        const token = await createPasswordReset(trx, user);
        const mail = passwordResetMail({ name: user.name, token });
        await sendMail({ to: user.email, subject: mail.subject, text: mail.text, html: mail.html });
      });
    } catch (err) {
      console.error('[quietfix] password reset mail failed:', (err as Error).message);
    }
  }
  return json({ ok: true, message: 'If that address has an account, a link is on its way.' }, 202);
});
