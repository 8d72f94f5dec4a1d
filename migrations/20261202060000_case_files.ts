import type { Knex } from 'knex';

// Self-contained: never import app code into a migration.
// Evidence files on a case (recordings, photos, PDFs): the bytes live in object storage under
// object_key; a row is 'pending' from the presigned upload until the server has checked the
// content ('ready'). Photos get a metadata-free copy (public_key) and a thumbnail (thumb_key).
// analysis: the audio signature's summary; signature: its spectrum and spectrogram.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('case_files', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('case_id').notNullable().references('cases.id').onDelete('CASCADE');
    t.uuid('uploaded_by').nullable().references('users.id').onDelete('SET NULL');
    t.text('name').notNullable();
    t.text('declared_type').notNullable();
    t.bigInteger('size').notNullable();
    t.text('object_key').notNullable().unique();
    t.text('status').notNullable().defaultTo('pending');
    t.text('kind').nullable();
    t.text('content_type').nullable();
    t.text('public_key').nullable();
    t.text('thumb_key').nullable();
    t.jsonb('analysis').nullable();
    t.jsonb('signature').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('completed_at', { useTz: true }).nullable();
    t.check("status in ('pending','ready')", [], 'case_files_status_check');
    t.check("kind is null or kind in ('audio','photo','document')", [], 'case_files_kind_check');
    t.check('size > 0', [], 'case_files_size_check');
    t.index(['case_id', 'created_at']);
    t.index(['status', 'created_at']);
  });
  await knex.schema.alterTable('club_settings', (t) => {
    t.integer('upload_max_mb').notNullable().defaultTo(25);
    t.check('upload_max_mb between 1 and 1000', [], 'club_settings_upload_max_check');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('club_settings', (t) => {
    t.dropChecks(['club_settings_upload_max_check']);
    t.dropColumn('upload_max_mb');
  });
  await knex.schema.dropTableIfExists('case_files');
}
