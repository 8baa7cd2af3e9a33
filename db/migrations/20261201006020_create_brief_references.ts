import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw('alter table files drop constraint files_purpose_check');
  await knex.raw("alter table files add constraint files_purpose_check check (purpose in ('attachment', 'test-knit-photo', 'mill-pack', 'brief-reference'))");
  await knex.raw("comment on column files.purpose is 'attachment, test-knit-photo, mill-pack or brief-reference'");

  await knex.schema.createTable('brief_references', (t) => {
    t.comment('Images of the reference board of a style brief, each with a caption and a tag, in the order the designer arranged them.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Reference id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style whose brief it belongs to');
    t.uuid('file_id').notNullable().references('files.id').onDelete('CASCADE').comment('The stored image (purpose brief-reference)');
    t.text('caption').notNullable().defaultTo('').comment('What the image shows, in the words of the designer');
    t.text('tag').notNullable().comment('colour, texture, silhouette or detail');
    t.integer('position').notNullable().comment('Place on the board, from 0');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Who uploaded it');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('Uploaded at');
    t.index(['style_id', 'position'], 'brief_references_style_position_idx');
    t.unique(['file_id'], { indexName: 'brief_references_file_unique' });
  });
  await knex.raw("alter table brief_references add constraint brief_references_tag_check check (tag in ('colour', 'texture', 'silhouette', 'detail'))");
  await knex.raw('alter table brief_references add constraint brief_references_position_check check (position >= 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('brief_references');
  await knex('files').where({ purpose: 'brief-reference' }).del();
  await knex.raw('alter table files drop constraint files_purpose_check');
  await knex.raw("alter table files add constraint files_purpose_check check (purpose in ('attachment', 'test-knit-photo', 'mill-pack'))");
  await knex.raw("comment on column files.purpose is 'attachment, test-knit-photo or mill-pack'");
}
