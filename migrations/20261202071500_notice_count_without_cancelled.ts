import type { Knex } from 'knex';

/**
 * The notice status 'cancelled' no longer exists (20261202050000_notice_status_without_cancelled),
 * so the trigger that keeps cases.notice_count counts every notice of the case, without the dead
 * filter. The count itself does not change. Self-contained: no app imports.
 */
const fn = (filter: string) => `
  CREATE OR REPLACE FUNCTION cases_count_notices() RETURNS trigger LANGUAGE plpgsql AS $$
  DECLARE cid uuid := coalesce(NEW.case_id, OLD.case_id);
  BEGIN
    UPDATE cases SET notice_count = (SELECT count(*) FROM notices n WHERE n.case_id = cid${filter}) WHERE id = cid;
    RETURN NULL;
  END $$;`;

export async function up(knex: Knex): Promise<void> {
  await knex.raw(fn(''));
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(fn(" AND n.status <> 'cancelled'"));
}
