/**
 * The outbox worker: delivers queued notices and committee alerts over SMTP with retries,
 * finishes what a crash left half-done, and prepares reminder drafts. Run it beside the app:
 *   node --import tsx scripts/outbox-worker.ts          poll for ever (Ctrl-C / SIGTERM stops cleanly)
 *   node --import tsx scripts/outbox-worker.ts --drain  exit once nothing is due or held by a lease
 *   ... --drain=SECONDS                                 and give up after SECONDS (default 120), exit code 1
 * Env: OUTBOX_POLL_MS (2000), OUTBOX_BATCH_SIZE (10), OUTBOX_LEASE_MS (60000),
 * OUTBOX_BACKOFF_BASE_MS (5000), OUTBOX_MAX_ATTEMPTS (8), plus the app's DB_* and SMTP_* settings.
 */
import { db } from '../db/index';
import { pendingNowOrLeased } from '../db/outbox';
import { env } from '../lib/env';
import { newWorkerId, runWorkerOnce } from '../lib/notices/outbox';

const drainArg = process.argv.find((a) => a === '--drain' || a.startsWith('--drain='));
const drain = drainArg !== undefined;
/** A drain is a wait like any other: bounded. */
const drainDeadline = Date.now() + 1000 * (Number(drainArg?.split('=')[1]) || 120);
const workerId = newWorkerId();
let stopping = false;
for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => (stopping = true));

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main() {
  const { OUTBOX_POLL_MS } = env;
  console.log(`quietfix outbox worker ${workerId} started${drain ? ' (drain)' : ''}`);
  while (!stopping) {
    let r;
    try {
      r = await runWorkerOnce({ workerId });
    } catch (err) {
      // Database down or the like: say so and try again after a pause; nothing is lost.
      console.error(`quietfix outbox: ${(err as Error).message}`);
      await sleep(OUTBOX_POLL_MS);
      continue;
    }
    if (r.claimed || r.effects || r.reminders) console.log(`quietfix outbox: ${JSON.stringify(r)}`);
    if (r.claimed > 0) continue; // more may be waiting
    if (drain && (await pendingNowOrLeased(db)) === 0) break;
    if (drain && Date.now() > drainDeadline) {
      console.error('quietfix outbox: drain gave up: mail is still due or leased after the time allowed.');
      process.exitCode = 1;
      break;
    }
    await sleep(OUTBOX_POLL_MS);
  }
  console.log('quietfix outbox worker stopped');
}

main()
  .catch((err) => {
    console.error('quietfix outbox worker failed:', err);
    process.exitCode = 1;
  })
  .finally(() => db.destroy());
