/**
 * The worker: runs every background job from the one queue (graphile-worker in PostgreSQL):
 * outbox e-mails (notices, alerts, account mail) with retries, reminders (cron, every minute),
 * and the evidence jobs (audio signatures, photo thumbnails, clean-up of unfinished uploads).
 *   node --import tsx scripts/outbox-worker.ts          run for ever (Ctrl-C / SIGTERM stops cleanly)
 *   node --import tsx scripts/outbox-worker.ts --drain  exit once no e-mail is due or held by a lease
 *   ... --drain=SECONDS                                 and give up after SECONDS (default 120), exit code 1
 * Env: OUTBOX_POLL_MS (2000: the queue's poll for delayed jobs and the rescue of rows a dead worker
 * held), OUTBOX_BATCH_SIZE (10: jobs in flight at once), OUTBOX_LEASE_MS (60000),
 * OUTBOX_BACKOFF_BASE_MS (5000), OUTBOX_MAX_ATTEMPTS (8), plus the app's DB_*, SMTP_* and S3_* settings.
 */
import { Logger, parseCronItems, run } from 'graphile-worker';
import { db } from '../db/index';
import { pendingNowOrLeased } from '../db/outbox';
import { env } from '../lib/env';
import { JOB } from '../lib/jobs/names';
import { queueConnectionString } from '../lib/jobs/connection';
import { evidenceTasks } from '../lib/evidence/tasks';
import { taskList } from '../lib/jobs/tasks';
import { newWorkerId, rescueOutbox } from '../lib/notices/outbox';

const drainArg = process.argv.find((a) => a === '--drain' || a.startsWith('--drain='));
const drain = drainArg !== undefined;
/** A drain is a wait like any other: bounded. */
const drainDeadline = Date.now() + 1000 * (Number(drainArg?.split('=')[1]) || 120);
const workerId = newWorkerId();
let stopping = false;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// Only warnings and errors from the queue itself; our tasks log what they did.
const logger = new Logger(() => (level, message) => {
  if (level === 'error' || level === 'warning') console.error(`quietfix queue ${level}: ${message}`);
});

async function main() {
  const { OUTBOX_POLL_MS, OUTBOX_BATCH_SIZE } = env;
  const runner = await run({
    connectionString: queueConnectionString(env),
    concurrency: OUTBOX_BATCH_SIZE,
    maxPoolSize: OUTBOX_BATCH_SIZE + 2,
    pollInterval: OUTBOX_POLL_MS,
    noHandleSignals: true,
    logger,
    taskList: taskList({ workerId }, evidenceTasks()),
    parsedCronItems: parseCronItems([
      { task: JOB.prepareReminders, match: '* * * * *' },
      { task: JOB.cleanUploads, match: '17 * * * *' },
    ]),
  });
  for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => (stopping = true));
  console.log(`quietfix outbox worker ${workerId} started${drain ? ' (drain)' : ''}`);
  while (!stopping) {
    try {
      const r = await rescueOutbox({ workerId });
      if (r.requeued || r.effects) console.log(`quietfix outbox: ${JSON.stringify(r)}`);
      if (drain && (await pendingNowOrLeased(db)) === 0) break;
    } catch (err) {
      // Database down or the like: say so and try again after a pause; nothing is lost.
      console.error(`quietfix outbox: ${(err as Error).message}`);
    }
    if (drain && Date.now() > drainDeadline) {
      console.error('quietfix outbox: drain gave up: mail is still due or leased after the time allowed.');
      process.exitCode = 1;
      break;
    }
    await sleep(OUTBOX_POLL_MS);
  }
  await runner.stop();
  console.log('quietfix outbox worker stopped');
}

main()
  .catch((err) => {
    console.error('quietfix outbox worker failed:', err);
    process.exitCode = 1;
  })
  .finally(() => db.destroy());
