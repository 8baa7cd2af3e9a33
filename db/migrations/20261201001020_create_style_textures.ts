import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('style_textures', (t) => {
    t.comment('Which library textures a style uses. Shared styles show these textures to their mill and client.');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    // Textures are archived, never deleted, while a style uses them.
    t.uuid('texture_id').notNullable().references('textures.id').onDelete('RESTRICT').comment('The library texture');
    t.integer('position').notNullable().defaultTo(0).comment('Order in the style texture list');
    t.uuid('added_by').nullable().references('users.id').onDelete('SET NULL').comment('Who added it');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['style_id', 'texture_id'], { constraintName: 'style_textures_pkey' });
    t.index(['texture_id'], 'style_textures_texture_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('style_textures');
}
