import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// A walked level trail: one row per level reading taken along the street (source 'walk', from the
// field screen) or read from an imported GPX survey (source 'gpx'). Both are the same kind of
// data — a position, a level, a time — so they share this table.
// client_id: a UUID the phone makes when the reading is typed, so a retried send (the offline
// queue) finds the row it already stored instead of making a second one. Bearings (and sweeps,
// which become bearings) carry one too.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('level_readings', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.uuid('author_id').nullable().references('users.id').onDelete('SET NULL');
    t.uuid('client_id').nullable();
    t.text('source').notNullable().defaultTo('walk'); // walk | gpx
    t.double('lat').notNullable();
    t.double('lon').notNullable();
    t.double('accuracy_m').nullable(); // the phone's stated position accuracy (GPX: hdop-derived or null)
    t.text('level_unit').notNullable(); // S | dBm, as read
    t.double('level_value').notNullable(); // as read
    t.double('level_dbm').notNullable(); // converted (IARU Region 1 S-units) and corrected by the hunter's S-meter offset
    t.double('frequency_khz').nullable();
    t.text('note').notNullable().defaultTo('');
    t.timestamp('taken_at', { useTz: true }).notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("source in ('walk','gpx')", [], 'level_readings_source_check');
    t.check("level_unit in ('S','dBm')", [], 'level_readings_unit_check');
    t.check('lat between -90 and 90 and lon between -180 and 180', [], 'level_readings_position_check');
    t.check('accuracy_m is null or accuracy_m >= 0', [], 'level_readings_accuracy_check');
    t.index(['case_id', 'taken_at']);
  });
  await knex.raw('CREATE UNIQUE INDEX level_readings_client_id_unique ON level_readings (client_id) WHERE client_id IS NOT NULL');
  await knex.raw(
    'ALTER TABLE level_readings ADD COLUMN geog geography(Point, 4326) GENERATED ALWAYS AS (geography(ST_SetSRID(ST_MakePoint(lon, lat), 4326))) STORED',
  );
  await knex.raw('CREATE INDEX level_readings_geog_gist ON level_readings USING gist (geog)');

  await knex.schema.alterTable('bearings', (t) => {
    t.uuid('client_id').nullable();
  });
  await knex.raw('CREATE UNIQUE INDEX bearings_client_id_unique ON bearings (client_id) WHERE client_id IS NOT NULL');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS bearings_client_id_unique');
  await knex.schema.alterTable('bearings', (t) => t.dropColumn('client_id'));
  await knex.schema.dropTableIfExists('level_readings');
}
