import { env } from '@/lib/env';
import { AppError, notFound } from '@/lib/errors';

export type CaughtMail = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  headers: Record<string, string>;
};

export const catcherInUse = () => env.MAIL_CATCHER_URL !== '';

/** Reads the local catcher's HTTP API (newest first). */
export async function listCaughtMail(limit = 50): Promise<{ items: CaughtMail[]; total: number }> {
  if (!catcherInUse()) throw notFound('The mail catcher is not in use: mail goes to a real relay.');
  try {
    const res = await fetch(`${env.MAIL_CATCHER_URL}/api/v2/messages?limit=${limit}`, { cache: 'no-store', signal: AbortSignal.timeout(3000) });
    if (!res.ok) throw new Error(`catcher answered ${res.status}`);
    return (await res.json()) as { items: CaughtMail[]; total: number };
  } catch (err) {
    console.error('[quietfix] mail catcher unreachable:', (err as Error).message);
    throw new AppError(503, 'The local mail catcher is not answering. Is `npm start` running?');
  }
}
