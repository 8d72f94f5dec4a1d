import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// PostGIS (Debian's postgresql-<version>-postgis-3, installed by npm start / npm test) for the spatial
// questions: positions as geography points with GiST indexes, and the places layer (streets, buildings).
export async function up(knex: Knex): Promise<void> {
  await knex.raw('CREATE EXTENSION IF NOT EXISTS postgis');

  // Derived from the lat/lon columns the app already writes, so no writer changes and no drift.
  const point = (lat: string, lon: string) =>
    `CASE WHEN ${lat} IS NOT NULL AND ${lon} IS NOT NULL THEN geography(ST_SetSRID(ST_MakePoint(${lon}, ${lat}), 4326)) END`;
  await knex.raw(`ALTER TABLE cases ADD COLUMN reported_geog geography(Point, 4326) GENERATED ALWAYS AS (${point('reported_lat', 'reported_lon')}) STORED`);
  await knex.raw('CREATE INDEX cases_reported_geog_gist ON cases USING gist (reported_geog)');
  await knex.raw(`ALTER TABLE bearings ADD COLUMN observer_geog geography(Point, 4326) GENERATED ALWAYS AS (${point('lat', 'lon')}) STORED`);
  await knex.raw('CREATE INDEX bearings_observer_geog_gist ON bearings USING gist (observer_geog)');
  await knex.raw(`ALTER TABLE fix_snapshots ADD COLUMN fix_geog geography(Point, 4326) GENERATED ALWAYS AS (${point('lat', 'lon')}) STORED`);
  await knex.raw('CREATE INDEX fix_snapshots_fix_geog_gist ON fix_snapshots USING gist (fix_geog)');

  await knex.schema.createTable('places', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('kind').notNullable(); // building | street
    // Where the row came from and its id there (e.g. 'osm' + 'way/123', 'geojson' + a feature id,
    // 'demo' + our own key): the key that makes a re-import update instead of duplicate.
    t.text('source').notNullable();
    t.text('source_id').notNullable();
    t.text('name').nullable(); // a street's name, or a building's own name
    t.text('housenumber').nullable();
    t.text('street').nullable();
    t.text('postcode').nullable();
    t.text('city').nullable();
    t.timestamps(true, true);
    t.unique(['source', 'source_id'], { indexName: 'places_source_key' });
    t.check("kind in ('building','street')", [], 'places_kind_check');
  });
  await knex.raw('ALTER TABLE places ADD COLUMN geom geometry(Geometry, 4326) NOT NULL');
  await knex.raw(
    `ALTER TABLE places ADD CONSTRAINT places_geom_kind_check CHECK (
      (kind = 'building' AND GeometryType(geom) IN ('POLYGON','MULTIPOLYGON')) OR
      (kind = 'street' AND GeometryType(geom) IN ('LINESTRING','MULTILINESTRING')))`,
  );
  await knex.raw('CREATE INDEX places_geom_gist ON places USING gist (geom)');
  await knex.raw('CREATE INDEX places_geog_gist ON places USING gist (geography(geom))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('places');
  await knex.raw('ALTER TABLE fix_snapshots DROP COLUMN IF EXISTS fix_geog');
  await knex.raw('ALTER TABLE bearings DROP COLUMN IF EXISTS observer_geog');
  await knex.raw('ALTER TABLE cases DROP COLUMN IF EXISTS reported_geog');
  await knex.raw('DROP EXTENSION IF EXISTS postgis');
}
