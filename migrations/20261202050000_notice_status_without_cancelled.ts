import type { Knex } from 'knex';

/**
 * No code ever wrote a notice status 'cancelled' (a notice is edited while a draft, and a sent
 * one stays on the record), so the status check stops allowing it. Self-contained: no app imports.
 */
const WITHOUT = "status in ('draft','approved','queued','sent','failed','hand-delivered')";
const WITH = "status in ('draft','approved','queued','sent','failed','hand-delivered','cancelled')";

export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE notices DROP CONSTRAINT notices_status_check');
  await knex.raw(`ALTER TABLE notices ADD CONSTRAINT notices_status_check CHECK (${WITHOUT})`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE notices DROP CONSTRAINT notices_status_check');
  await knex.raw(`ALTER TABLE notices ADD CONSTRAINT notices_status_check CHECK (${WITH})`);
}
