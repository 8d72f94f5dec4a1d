import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

let transporter: Transporter | undefined;

/** The one SMTP transport: the local catcher by default, a real relay by configuration. */
export function mailer(): Transporter {
  transporter ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
    // The local catcher speaks plain SMTP; a real relay negotiates STARTTLS when offered.
    ignoreTLS: !env.SMTP_SECURE && !env.SMTP_USER,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
  return transporter;
}

export type OutgoingMail = { to: string; subject: string; text: string; html?: string; messageId?: string; headers?: Record<string, string> };

export async function sendMail(m: OutgoingMail): Promise<{ messageId: string }> {
  const info = await mailer().sendMail({ from: env.MAIL_FROM, ...m });
  return { messageId: info.messageId };
}
