import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('colourways', (t) => {
    t.comment('A colourway of a style: a set of target colours for its yarn groups, with their dye routes.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Colourway id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.text('name').notNullable().comment('Display name, unique among the active colourways of the style');
    t.text('notes').notNullable().defaultTo('').comment('Free notes of the colour lead');
    t.integer('position').notNullable().defaultTo(0).comment('Order among the style colourways');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write to the colourway or its targets');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was created');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was last changed');
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when archived; archived colourways are hidden, their lab dips kept');
    t.index(['style_id', 'position'], 'colourways_style_position_idx');
  });
  await knex.raw('create unique index colourways_style_name_active_unique on colourways (style_id, lower(name)) where archived_at is null');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('colourways');
}
