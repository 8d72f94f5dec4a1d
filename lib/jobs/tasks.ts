import type { TaskList } from 'graphile-worker';
import { deliverQueued, type WorkerOptions } from '@/lib/notices/outbox';
import { prepareReminders } from '@/lib/notices/reminders';
import { db } from '@/db';
import { JOB } from './names';

type Payload<K extends string> = { [k in K]: string };

function need<K extends string>(payload: unknown, ...keys: K[]): Payload<K> {
  const p = (payload ?? {}) as Record<string, unknown>;
  for (const k of keys) if (typeof p[k] !== 'string' || !p[k]) throw new Error(`job payload lacks ${k}`);
  return p as Payload<K>;
}

/** Every background job, one queue; run by scripts/outbox-worker.ts. */
export function taskList(o: WorkerOptions & { workerId: string }, more: TaskList = {}): TaskList {
  return {
    [JOB.deliverMail]: async (payload) => {
      await deliverQueued(need(payload, 'outboxId').outboxId, o);
    },
    [JOB.prepareReminders]: async (_payload, helpers) => {
      const n = await prepareReminders(o.knex ?? db);
      if (n) helpers.logger.info(`prepared ${n} follow-up draft(s)`);
    },
    ...more,
  };
}

export { need as jobPayload };
