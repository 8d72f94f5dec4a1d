import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('CREATE EXTENSION IF NOT EXISTS pgcrypto');

  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable();
    t.text('name').notNullable();
    t.text('call_sign').nullable();
    t.text('role').notNullable();
    t.text('password_hash').nullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamps(true, true);
    t.check("role in ('admin','coordinator','hunter','member')", [], 'users_role_check');
  });
  await knex.raw('CREATE UNIQUE INDEX users_email_unique ON users (lower(email))');

  await knex.schema.createTable('club_settings', (t) => {
    t.integer('id').primary().defaultTo(1);
    t.text('club_name').notNullable();
    t.text('contact_email').notNullable();
    t.double('locate_threshold_m').notNullable().defaultTo(75);
    t.integer('reminder_days').notNullable().defaultTo(14);
    t.timestamps(true, true);
    t.check('id = 1', [], 'club_settings_single_row');
    t.check('locate_threshold_m > 0', [], 'club_settings_threshold_positive');
    t.check('reminder_days > 0', [], 'club_settings_reminder_positive');
  });

  await knex.raw('CREATE SEQUENCE case_reference_seq START 1');
  await knex.schema.createTable('cases', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('reference').notNullable().unique();
    t.text('title').notNullable();
    t.text('description').notNullable().defaultTo('');
    t.text('status').notNullable().defaultTo('open');
    t.uuid('reporter_id').nullable().references('users.id').onDelete('SET NULL');
    t.uuid('assignee_id').nullable().references('users.id').onDelete('SET NULL');
    t.double('reported_lat').nullable();
    t.double('reported_lon').nullable();
    t.specificType('bands', 'text[]').notNullable().defaultTo('{}');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check("status in ('open','located','notified','resolved')", [], 'cases_status_check');
    t.check('reported_lat is null or reported_lat between -90 and 90', [], 'cases_lat_check');
    t.check('reported_lon is null or reported_lon between -180 and 180', [], 'cases_lon_check');
    t.index(['status']);
    t.index(['assignee_id']);
    t.index(['reporter_id']);
  });

  await knex.schema.createTable('case_events', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.uuid('actor_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('kind').notNullable();
    t.jsonb('data').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['case_id', 'created_at']);
  });
  // The timeline is append-only: the database itself refuses edits and deletions.
  await knex.raw(`
    CREATE FUNCTION case_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'case_events is append-only' USING ERRCODE = 'restrict_violation';
    END $$;
    CREATE TRIGGER case_events_no_update BEFORE UPDATE ON case_events
      FOR EACH ROW EXECUTE FUNCTION case_events_append_only();
    CREATE TRIGGER case_events_no_delete BEFORE DELETE ON case_events
      FOR EACH ROW WHEN (pg_trigger_depth() = 0) EXECUTE FUNCTION case_events_append_only();
  `);

  await knex.schema.createTable('user_tokens', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('purpose').notNullable();
    t.text('token_hash').notNullable().unique();
    t.text('email').notNullable();
    t.text('name').nullable();
    t.text('role').nullable();
    t.uuid('user_id').nullable().references('users.id').onDelete('CASCADE');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("purpose in ('invite','reset')", [], 'user_tokens_purpose_check');
  });

  await knex.schema.createTable('sign_in_failures', (t) => {
    t.text('key').primary();
    t.integer('failures').notNullable().defaultTo(0);
    t.timestamp('window_started_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('sign_in_failures');
  await knex.schema.dropTableIfExists('user_tokens');
  await knex.schema.dropTableIfExists('case_events');
  await knex.raw('DROP FUNCTION IF EXISTS case_events_append_only()');
  await knex.schema.dropTableIfExists('cases');
  await knex.raw('DROP SEQUENCE IF EXISTS case_reference_seq');
  await knex.schema.dropTableIfExists('club_settings');
  await knex.schema.dropTableIfExists('users');
}
