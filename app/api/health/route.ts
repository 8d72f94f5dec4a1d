import { pingDatabase } from '@/db';
import { json, route } from '@/lib/api/handler';

export const dynamic = 'force-dynamic';

/** 200 {ok, db: "up"} when PostgreSQL answers within 3 s; 503 otherwise (never hangs). */
export const GET = route(async () => {
  try {
    await Promise.race([
      pingDatabase(),
      new Promise((_, reject) => setTimeout(() => reject(new Error('health check timed out')), 3000)),
    ]);
    return json({ ok: true, db: 'up' });
  } catch (err) {
    console.error('[quietfix] health: database not answering:', (err as Error).message);
    return json({ ok: false, db: 'down' }, 503);
  }
});
