import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('quotes', (t) => {
    t.comment('What the designer entered for the quote of a style: machine speed, feeders per course, efficiency and rates that differ from the studio settings, making-up costs per garment. Staff only: never shown to mill or client accounts.');
    t.uuid('style_id').primary().references('styles.id').onDelete('CASCADE').comment('The style quoted');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.jsonb('inputs').notNullable().comment('Entries of the quote; what is absent comes from the studio costing settings');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write; a stale write gets 409');
    t.uuid('updated_by').nullable().references('users.id').onDelete('SET NULL').comment('Who saved it last');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('Last saved');
    t.index(['studio_id'], 'quotes_studio_idx');
  });
  await knex.raw('alter table quotes add constraint quotes_version_positive check (version > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('quotes');
}
