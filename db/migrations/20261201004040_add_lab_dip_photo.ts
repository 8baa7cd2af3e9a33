import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_dips', (t) => {
    // No foreign key: the files table comes later in the migration order; the data layer checks it on write.
    t.uuid('photo_file_id').nullable().comment('Photo of the dip: a files row of the same style, uploaded through the style file route; null when none');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('lab_dips', (t) => {
    t.dropColumn('photo_file_id');
  });
}
