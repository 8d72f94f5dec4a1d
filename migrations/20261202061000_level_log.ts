import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// The level log: spot readings of the noise on a frequency, with the receiver bandwidth, before
// or after a fix (not the walked trail, which is level_readings). Stored as entered and in dBm.
// The club's noise environment (ITU-R P.372 category) sets the expected floor they are shown against.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('case_levels', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.uuid('client_id').nullable();
    t.uuid('author_id').nullable().references('users.id').onDelete('SET NULL');
    t.double('frequency_khz').notNullable();
    t.text('level_unit').notNullable();
    t.double('level_value').notNullable();
    t.double('over_s9_db').notNullable().defaultTo(0);
    t.double('level_dbm').notNullable();
    t.double('bandwidth_hz').notNullable();
    t.timestamp('taken_at', { useTz: true }).notNullable();
    t.double('lat').nullable();
    t.double('lon').nullable();
    t.text('phase').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['case_id', 'client_id'], { indexName: 'case_levels_one_per_client_id' });
    t.check("level_unit in ('S','dBm')", [], 'case_levels_unit_check');
    t.check("phase in ('before','after')", [], 'case_levels_phase_check');
    t.check('frequency_khz > 0 and bandwidth_hz > 0', [], 'case_levels_positive_check');
    t.check('(lat is null) = (lon is null) and (lat is null or (lat between -90 and 90 and lon between -180 and 180))', [], 'case_levels_position_check');
    t.index(['case_id', 'taken_at']);
  });
  await knex.schema.alterTable('club_settings', (t) => {
    t.text('noise_environment').notNullable().defaultTo('residential');
    t.check("noise_environment in ('city','residential','rural','quiet-rural')", [], 'club_settings_noise_environment_check');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('club_settings', (t) => {
    t.dropChecks(['club_settings_noise_environment_check']);
    t.dropColumn('noise_environment');
  });
  await knex.schema.dropTableIfExists('case_levels');
}
