import type { Knex } from 'knex';

/**
 * The one job queue (graphile-worker's schema `graphile_worker`, installed by `npm run migrate`).
 * A job is added through the caller's knex or transaction, so it exists exactly when the row that
 * causes it commits: a rollback leaves no job. Task names are listed in lib/jobs/names.ts.
 */
export type AddJobOptions = {
  /** one job per key: adding again moves the waiting job (a running one is left to finish, a new one queued) */
  jobKey?: string;
  runAt?: Date;
  maxAttempts?: number;
};

export async function addJob(q: Knex, task: string, payload: Record<string, unknown>, o: AddJobOptions = {}): Promise<void> {
  await q.raw('select graphile_worker.add_job(?, ?::json, run_at => ?::timestamptz, max_attempts => ?::int, job_key => ?)', [
    task,
    JSON.stringify(payload),
    o.runAt ? o.runAt.toISOString() : null,
    o.maxAttempts ?? null,
    o.jobKey ?? null,
  ]);
}

/** Jobs of these tasks still waiting or running (a drain waits for them). */
export async function jobsWaiting(q: Knex, tasks: readonly string[]): Promise<number> {
  const { rows } = await q.raw('select count(*)::int as n from graphile_worker.jobs where task_identifier = any(?) and attempts < max_attempts', [tasks as string[]]);
  return rows[0].n;
}
