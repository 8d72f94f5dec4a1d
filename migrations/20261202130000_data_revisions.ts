import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// A revision number for the data behind the committee's lists (the queue and the map of all cases):
// every transaction that writes cases, or an assignee's name, adds one at its commit. An answer
// cached under the revision read before it was computed is never older than that revision, so a
// cache keyed on it is exact (lib/cache/by-revision.ts).
//
// The bump is a deferred constraint trigger: it runs at commit, the transaction's last write, so
// the one revision row is locked only for the instant before commit (no deadlock with the
// transaction's other locks, and writers wait on each other only there), and once per
// transaction (a transaction-local setting remembers that it was done).
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE TABLE data_revisions (name text PRIMARY KEY, rev bigint NOT NULL DEFAULT 0);
    INSERT INTO data_revisions (name) VALUES ('cases');

    CREATE FUNCTION data_revision_bump() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_LEVEL = 'ROW' THEN
        IF current_setting('quietfix.revision_' || TG_ARGV[0], true) = 'bumped' THEN RETURN NULL; END IF;
        PERFORM set_config('quietfix.revision_' || TG_ARGV[0], 'bumped', true);
      END IF;
      UPDATE data_revisions SET rev = rev + 1 WHERE name = TG_ARGV[0];
      RETURN NULL;
    END $$;

    CREATE CONSTRAINT TRIGGER cases_revision AFTER INSERT OR UPDATE OR DELETE ON cases
      DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION data_revision_bump('cases');
    CREATE CONSTRAINT TRIGGER users_name_revision AFTER UPDATE OF name OR DELETE ON users
      DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION data_revision_bump('cases');
    CREATE TRIGGER cases_truncate_revision AFTER TRUNCATE ON cases
      FOR EACH STATEMENT EXECUTE FUNCTION data_revision_bump('cases');
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    DROP TRIGGER IF EXISTS cases_truncate_revision ON cases;
    DROP TRIGGER IF EXISTS users_name_revision ON users;
    DROP TRIGGER IF EXISTS cases_revision ON cases;
    DROP FUNCTION IF EXISTS data_revision_bump();
    DROP TABLE IF EXISTS data_revisions;
  `);
}
