import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// The committee's queue, map and statistics at 100,000 cases: sort keys kept on the case row by
// triggers (so no writer changes and no drift), the indexes the queue/map/statistics queries use
// (each checked with EXPLAIN in tests/integration/queue-indexes.test.ts), trigram search, saved
// filters per user, and the timeline of club settings.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  await knex.schema.alterTable('cases', (t) => {
    t.timestamp('status_since', { useTz: true }).nullable();
    t.timestamp('located_at', { useTz: true }).nullable();
    t.timestamp('notified_at', { useTz: true }).nullable();
    t.timestamp('last_activity_at', { useTz: true }).nullable();
    t.double('fix_lat').nullable();
    t.double('fix_lon').nullable();
    t.double('fix_size_m').nullable(); // semi-major axis of the current fix's 95 % ellipse
    t.integer('notice_count').notNullable().defaultTo(0);
  });
  // Backfill from what is known today.
  await knex.raw(`UPDATE cases c SET
      status_since = coalesce((SELECT max(e.created_at) FROM case_events e WHERE e.case_id = c.id AND e.kind = 'status-changed'), c.created_at),
      last_activity_at = greatest(c.updated_at, coalesce((SELECT max(e.created_at) FROM case_events e WHERE e.case_id = c.id), c.updated_at)),
      notice_count = (SELECT count(*) FROM notices n WHERE n.case_id = c.id AND n.status <> 'cancelled')`);
  await knex.raw(`UPDATE cases c SET fix_lat = f.lat, fix_lon = f.lon, fix_size_m = f.semi_major_m
    FROM (SELECT DISTINCT ON (case_id) case_id, lat, lon, semi_major_m FROM fix_snapshots WHERE ok ORDER BY case_id, id DESC) f
    WHERE f.case_id = c.id`);
  await knex.raw(`UPDATE cases SET located_at = status_since WHERE status = 'located'`);
  await knex.raw(`UPDATE cases SET notified_at = status_since WHERE status = 'notified'`);
  await knex.raw('ALTER TABLE cases ALTER COLUMN status_since SET DEFAULT now(), ALTER COLUMN status_since SET NOT NULL');
  await knex.raw('ALTER TABLE cases ALTER COLUMN last_activity_at SET DEFAULT now(), ALTER COLUMN last_activity_at SET NOT NULL');
  // Where a case sits on the map of all cases: its fix when it has one, else the reported position.
  await knex.raw(`ALTER TABLE cases ADD COLUMN map_point geometry(Point, 4326) GENERATED ALWAYS AS (
      CASE WHEN fix_lat IS NOT NULL AND fix_lon IS NOT NULL THEN ST_SetSRID(ST_MakePoint(fix_lon, fix_lat), 4326)
           WHEN reported_lat IS NOT NULL AND reported_lon IS NOT NULL THEN ST_SetSRID(ST_MakePoint(reported_lon, reported_lat), 4326) END) STORED`);

  await knex.raw(`
    CREATE FUNCTION cases_track_status() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF NEW.status IS DISTINCT FROM OLD.status THEN
        NEW.status_since := now();
        IF NEW.status = 'located' AND NEW.located_at IS NULL THEN NEW.located_at := now(); END IF;
        IF NEW.status = 'notified' AND NEW.notified_at IS NULL THEN NEW.notified_at := now(); END IF;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER cases_track_status BEFORE UPDATE OF status ON cases
      FOR EACH ROW EXECUTE FUNCTION cases_track_status();

    CREATE FUNCTION cases_touch_activity() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE cases SET last_activity_at = greatest(last_activity_at, NEW.created_at) WHERE id = NEW.case_id;
      RETURN NULL;
    END $$;
    CREATE TRIGGER case_events_touch_activity AFTER INSERT ON case_events
      FOR EACH ROW EXECUTE FUNCTION cases_touch_activity();

    CREATE FUNCTION cases_track_fix() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE cases SET
        fix_lat = CASE WHEN NEW.ok THEN NEW.lat END,
        fix_lon = CASE WHEN NEW.ok THEN NEW.lon END,
        fix_size_m = CASE WHEN NEW.ok THEN NEW.semi_major_m END,
        last_activity_at = greatest(last_activity_at, NEW.created_at)
      WHERE id = NEW.case_id;
      RETURN NULL;
    END $$;
    CREATE TRIGGER fix_snapshots_track_fix AFTER INSERT ON fix_snapshots
      FOR EACH ROW EXECUTE FUNCTION cases_track_fix();

    CREATE FUNCTION cases_count_notices() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE cid uuid := coalesce(NEW.case_id, OLD.case_id);
    BEGIN
      UPDATE cases SET notice_count = (SELECT count(*) FROM notices n WHERE n.case_id = cid AND n.status <> 'cancelled') WHERE id = cid;
      RETURN NULL;
    END $$;
    CREATE TRIGGER notices_count AFTER INSERT OR DELETE OR UPDATE OF status ON notices
      FOR EACH ROW EXECUTE FUNCTION cases_count_notices();
  `);

  // Queue sort keys, with id as the tie-breaker the keyset cursor uses; with and without a status filter.
  for (const col of ['last_activity_at', 'status_since', 'created_at']) {
    await knex.raw(`CREATE INDEX cases_queue_${col} ON cases (${col}, id)`);
    await knex.raw(`CREATE INDEX cases_queue_status_${col} ON cases (status, ${col}, id)`);
  }
  await knex.raw('CREATE INDEX cases_queue_assignee_activity ON cases (assignee_id, last_activity_at, id)');
  await knex.raw('CREATE INDEX cases_queue_reporter_activity ON cases (reporter_id, last_activity_at, id)');
  // Text search (substring, any case) over reference, title and description.
  await knex.raw(`CREATE INDEX cases_search_trgm ON cases USING gin ((reference || ' ' || title || ' ' || description) gin_trgm_ops)`);
  await knex.raw('CREATE INDEX cases_map_point_gist ON cases USING gist (map_point)');
  // The statistics read these columns only (an index-only scan instead of the table).
  await knex.raw(`CREATE INDEX cases_stats_cover ON cases (created_at) INCLUDE
      (status, located_at, notified_at, resolved_at, outcome, level_before_dbm, level_after_dbm, assignee_id)`);

  await knex.schema.createTable('saved_filters', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('query').notNullable(); // the queue's URL query string
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['user_id', 'name'], { indexName: 'saved_filters_user_name' });
  });

  await knex.schema.alterTable('club_settings', (t) => {
    // noise_environment and upload_max_mb come with the level log and case files migrations.
    t.integer('version').notNullable().defaultTo(1);
  });
  await knex.schema.createTable('club_settings_events', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('actor_id').nullable().references('users.id').onDelete('SET NULL');
    t.jsonb('changes').notNullable(); // { field: { from, to } }
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('club_settings_events');
  await knex.schema.alterTable('club_settings', (t) => {
    t.dropColumn('version');
  });
  await knex.schema.dropTableIfExists('saved_filters');
  await knex.raw(`
    DROP TRIGGER IF EXISTS notices_count ON notices; DROP FUNCTION IF EXISTS cases_count_notices();
    DROP TRIGGER IF EXISTS fix_snapshots_track_fix ON fix_snapshots; DROP FUNCTION IF EXISTS cases_track_fix();
    DROP TRIGGER IF EXISTS case_events_touch_activity ON case_events; DROP FUNCTION IF EXISTS cases_touch_activity();
    DROP TRIGGER IF EXISTS cases_track_status ON cases; DROP FUNCTION IF EXISTS cases_track_status();
  `);
  await knex.raw('DROP INDEX IF EXISTS cases_stats_cover, cases_map_point_gist, cases_search_trgm, cases_queue_assignee_activity, cases_queue_reporter_activity');
  for (const col of ['last_activity_at', 'status_since', 'created_at']) {
    await knex.raw(`DROP INDEX IF EXISTS cases_queue_${col}, cases_queue_status_${col}`);
  }
  await knex.raw('ALTER TABLE cases DROP COLUMN IF EXISTS map_point');
  await knex.schema.alterTable('cases', (t) => {
    t.dropColumns('status_since', 'located_at', 'notified_at', 'last_activity_at', 'fix_lat', 'fix_lon', 'fix_size_m', 'notice_count');
  });
}
