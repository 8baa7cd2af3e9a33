import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('files', (t) => {
    t.comment('Private files kept in the object store (photos, SVG, PDF): one row per stored object, written only once the object is stored.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('File id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.uuid('style_id').nullable().references('styles.id').onDelete('CASCADE').comment('The style the file belongs to');
    t.uuid('release_id').nullable().comment('The release a generated mill pack belongs to (foreign key added with the releases table)');
    t.uuid('organisation_id').nullable().references('organisations.id').onDelete('SET NULL')
      .comment('Organisation of the outside account that uploaded it; null for studio staff and generated files');
    t.uuid('uploaded_by').nullable().references('users.id').onDelete('SET NULL').comment('Who uploaded or generated it');
    t.text('purpose').notNullable().comment('attachment, test-knit-photo or mill-pack');
    t.text('kind').notNullable().comment('photo, svg or pdf: the type read from the content');
    t.text('content_type').notNullable().comment('MIME type served with it');
    t.integer('byte_size').notNullable().comment('Stored size in bytes');
    t.integer('width_px').nullable().comment('Image width in px (photos)');
    t.integer('height_px').nullable().comment('Image height in px (photos)');
    t.text('sha256').notNullable().comment('SHA-256 of the stored bytes, hex');
    t.text('storage_key').notNullable().comment('Object key in the bucket');
    t.text('original_name').notNullable().defaultTo('').comment('File name as uploaded (shown only; never used as a path)');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['storage_key'], { indexName: 'files_storage_key_unique' });
    t.index(['style_id', 'created_at'], 'files_style_idx');
  });
  await knex.raw("alter table files add constraint files_purpose_check check (purpose in ('attachment', 'test-knit-photo', 'mill-pack'))");
  await knex.raw("alter table files add constraint files_kind_check check (kind in ('photo', 'svg', 'pdf'))");
  await knex.raw('alter table files add constraint files_size_check check (byte_size > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('files');
}
