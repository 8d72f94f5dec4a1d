import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.text('loop_shape').nullable(); // circle | square | octagon | other
    t.double('loop_size_m').nullable(); // diameter (circle) or side (square, octagon)
    t.double('loop_circumference_m').nullable();
    t.double('s_meter_offset_db').notNullable().defaultTo(0);
    t.text('bearing_reference').notNullable().defaultTo('magnetic'); // the reference the hunter usually reads in
    t.check("bearing_reference in ('true','magnetic')", [], 'users_bearing_reference_check');
    t.check('loop_circumference_m is null or loop_circumference_m > 0', [], 'users_loop_circumference_check');
  });

  await knex.schema.alterTable('club_settings', (t) => {
    t.double('max_position_accuracy_m').notNullable().defaultTo(30);
  });

  await knex.schema.alterTable('cases', (t) => {
    t.jsonb('report').notNullable().defaultTo('{}'); // sound, frequencies, level, schedule as reported
    t.boolean('consent_share_name').notNullable().defaultTo(false);
    t.uuid('possible_duplicate_of').nullable().references('cases.id').onDelete('SET NULL');
    t.uuid('merged_into').nullable().references('cases.id').onDelete('SET NULL');
    t.text('outcome').nullable();
    t.double('level_before_dbm').nullable();
    t.double('level_after_dbm').nullable();
    t.timestamp('resolved_at', { useTz: true }).nullable();
    t.check(
      "outcome is null or outcome in ('fixed-by-owner','mitigated','utility-repaired','referred-to-regulator','stopped-on-its-own','not-found','duplicate')",
      [],
      'cases_outcome_check',
    );
  });
  await knex.raw('CREATE INDEX cases_bands_gin ON cases USING gin (bands)');

  await knex.schema.alterTable('case_events', (t) => {
    // 'all': the reporter may read it too; 'committee': coordinators, admins and the assigned hunter.
    t.text('visibility').notNullable().defaultTo('committee');
    t.check("visibility in ('all','committee')", [], 'case_events_visibility_check');
  });

  await knex.schema.createTable('bearings', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.uuid('author_id').nullable().references('users.id').onDelete('SET NULL');
    t.double('lat').notNullable();
    t.double('lon').notNullable();
    t.text('position_source').notNullable(); // device | map
    t.double('position_accuracy_m').nullable();
    t.double('azimuth_entered_deg').notNullable();
    t.text('reference').notNullable(); // true | magnetic
    t.double('declination_deg').notNullable().defaultTo(0);
    t.double('azimuth_true_deg').notNullable();
    t.double('sigma_deg').notNullable();
    t.double('null_width_deg').nullable();
    t.double('frequency_khz').nullable();
    t.boolean('one_way').notNullable().defaultTo(false);
    t.text('note').notNullable().defaultTo('');
    t.jsonb('sweep').nullable(); // readings and fit when the bearing came from a rotation sweep
    t.boolean('excluded').notNullable().defaultTo(false);
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('taken_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamps(true, true);
    t.check("position_source in ('device','map')", [], 'bearings_position_source_check');
    t.check("reference in ('true','magnetic')", [], 'bearings_reference_check');
    t.check('lat between -90 and 90 and lon between -180 and 180', [], 'bearings_position_check');
    t.check('sigma_deg > 0', [], 'bearings_sigma_check');
    t.index(['case_id']);
  });

  // Every earlier state of a bearing, so nothing is silently lost.
  await knex.schema.createTable('bearing_revisions', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('bearing_id').notNullable().references('bearings.id').onDelete('CASCADE');
    t.uuid('editor_id').nullable().references('users.id').onDelete('SET NULL');
    t.integer('version').notNullable();
    t.jsonb('before').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['bearing_id']);
  });

  await knex.schema.createTable('fix_snapshots', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.text('cause').notNullable();
    t.integer('line_count').notNullable();
    t.boolean('ok').notNullable();
    t.double('lat').nullable();
    t.double('lon').nullable();
    t.double('semi_major_m').nullable();
    t.double('semi_minor_m').nullable();
    t.double('major_axis_azimuth_deg').nullable();
    t.jsonb('result').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['case_id', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('fix_snapshots');
  await knex.schema.dropTableIfExists('bearing_revisions');
  await knex.schema.dropTableIfExists('bearings');
  await knex.schema.alterTable('case_events', (t) => {
    t.dropChecks(['case_events_visibility_check']);
    t.dropColumn('visibility');
  });
  await knex.raw('DROP INDEX IF EXISTS cases_bands_gin');
  await knex.schema.alterTable('cases', (t) => {
    t.dropChecks(['cases_outcome_check']);
    t.dropColumns('report', 'consent_share_name', 'possible_duplicate_of', 'merged_into', 'outcome', 'level_before_dbm', 'level_after_dbm', 'resolved_at');
  });
  await knex.schema.alterTable('club_settings', (t) => t.dropColumn('max_position_accuracy_m'));
  await knex.schema.alterTable('users', (t) => {
    t.dropChecks(['users_bearing_reference_check', 'users_loop_circumference_check']);
    t.dropColumns('loop_shape', 'loop_size_m', 'loop_circumference_m', 's_meter_offset_db', 'bearing_reference');
  });
}
