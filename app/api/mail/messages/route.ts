import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { listCaughtMail } from '@/lib/mail/catcher-client';

/** Admin only: what the local mail catcher holds (404 when a real relay is configured). */
export const GET = route(async () => {
  await requireUser('admin');
  return json(await listCaughtMail());
});
