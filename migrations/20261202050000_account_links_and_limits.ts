import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
//
// Account links and sessions: a session version on each user (a password change or reset bumps
// it, and every older session stops working); a nonce on each invitation/reset link so the link
// can be derived with the server secret at send time instead of being stored; account mail goes
// through the outbox (kind 'account', tied to its link). Sign-in and reset limits share one
// table of counters (the old sign_in_failures, renamed: it now counts attempts, not failures).

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('session_version').notNullable().defaultTo(1);
  });
  await knex.schema.alterTable('user_tokens', (t) => {
    t.text('nonce').nullable();
  });
  await knex.raw("CREATE INDEX user_tokens_open_resets ON user_tokens (user_id) WHERE purpose = 'reset' AND used_at IS NULL");
  await knex.raw("CREATE INDEX user_tokens_open_invites ON user_tokens (lower(email)) WHERE purpose = 'invite' AND used_at IS NULL");

  await knex.schema.renameTable('sign_in_failures', 'auth_limits');
  await knex.schema.alterTable('auth_limits', (t) => {
    t.renameColumn('failures', 'hits');
  });

  await knex.schema.alterTable('outbox', (t) => {
    t.uuid('user_token_id').nullable().references('user_tokens.id').onDelete('CASCADE');
  });
  await knex.raw('ALTER TABLE outbox DROP CONSTRAINT outbox_kind_check');
  await knex.raw("ALTER TABLE outbox ADD CONSTRAINT outbox_kind_check CHECK (kind in ('notice','alert','account'))");
  await knex.raw("ALTER TABLE outbox ADD CONSTRAINT outbox_account_has_token CHECK (kind <> 'account' or user_token_id is not null)");
  await knex.raw('ALTER TABLE outbox DROP CONSTRAINT outbox_notice_has_id');
  await knex.raw("ALTER TABLE outbox ADD CONSTRAINT outbox_notice_has_id CHECK (kind <> 'notice' or notice_id is not null)");
}

export async function down(knex: Knex): Promise<void> {
  await knex('outbox').where({ kind: 'account' }).delete();
  await knex.raw('ALTER TABLE outbox DROP CONSTRAINT outbox_notice_has_id');
  await knex.raw("ALTER TABLE outbox ADD CONSTRAINT outbox_notice_has_id CHECK (kind = 'alert' or notice_id is not null)");
  await knex.raw('ALTER TABLE outbox DROP CONSTRAINT outbox_account_has_token');
  await knex.raw('ALTER TABLE outbox DROP CONSTRAINT outbox_kind_check');
  await knex.raw("ALTER TABLE outbox ADD CONSTRAINT outbox_kind_check CHECK (kind in ('notice','alert'))");
  await knex.schema.alterTable('outbox', (t) => {
    t.dropColumn('user_token_id');
  });

  await knex.schema.alterTable('auth_limits', (t) => {
    t.renameColumn('hits', 'failures');
  });
  await knex.schema.renameTable('auth_limits', 'sign_in_failures');

  await knex.raw('DROP INDEX IF EXISTS user_tokens_open_invites');
  await knex.raw('DROP INDEX IF EXISTS user_tokens_open_resets');
  await knex.schema.alterTable('user_tokens', (t) => {
    t.dropColumn('nonce');
  });
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('session_version');
  });
}
