import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// The premises a hunter confirmed on foot: one per case (a later confirmation replaces it; the
// timeline keeps every one). Personal data: the committee and the assigned hunter only.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('case_premises', (t) => {
    t.uuid('case_id').primary().references('cases.id').onDelete('CASCADE');
    t.uuid('place_id').nullable().references('places.id').onDelete('SET NULL');
    t.text('address').notNullable();
    t.double('lat').notNullable();
    t.double('lon').notNullable();
    t.uuid('confirmed_by').nullable().references('users.id').onDelete('SET NULL');
    t.text('how').notNullable(); // level-peak | switch-off-test | other
    t.text('note').notNullable().defaultTo('');
    t.timestamp('confirmed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("how in ('level-peak','switch-off-test','other')", [], 'case_premises_how_check');
    t.check('lat between -90 and 90 and lon between -180 and 180', [], 'case_premises_position_check');
    t.index(['place_id']);
  });
  await knex.raw(
    'ALTER TABLE case_premises ADD COLUMN geog geography(Point, 4326) GENERATED ALWAYS AS (geography(ST_SetSRID(ST_MakePoint(lon, lat), 4326))) STORED',
  );
  await knex.raw('CREATE INDEX case_premises_geog_gist ON case_premises USING gist (geog)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('case_premises');
}
