import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw('alter table files drop constraint files_purpose_check');
  await knex.raw(
    "alter table files add constraint files_purpose_check check (purpose in ('attachment', 'test-knit-photo', 'mill-pack', 'brief-reference', 'sample-round-photo'))",
  );
  await knex.raw("comment on column files.purpose is 'attachment, test-knit-photo, mill-pack, brief-reference or sample-round-photo'");

  await knex.schema.createTable('sample_round_photos', (t) => {
    t.comment('Photos of the sample of a sample round: on the form or the fit model, details, faults.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Photo id');
    t.uuid('round_id').notNullable().references('sample_rounds.id').onDelete('CASCADE').comment('The round the photo belongs to');
    t.uuid('file_id').notNullable().references('files.id').onDelete('CASCADE').comment('The stored image (purpose sample-round-photo)');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Who attached it');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('Attached at');
    t.index(['round_id', 'created_at'], 'sample_round_photos_round_idx');
    t.unique(['file_id'], { indexName: 'sample_round_photos_file_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_round_photos');
  await knex('files').where({ purpose: 'sample-round-photo' }).del();
  await knex.raw('alter table files drop constraint files_purpose_check');
  await knex.raw("alter table files add constraint files_purpose_check check (purpose in ('attachment', 'test-knit-photo', 'mill-pack', 'brief-reference'))");
  await knex.raw("comment on column files.purpose is 'attachment, test-knit-photo, mill-pack or brief-reference'");
}
