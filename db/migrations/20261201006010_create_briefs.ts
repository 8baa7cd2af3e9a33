import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('briefs', (t) => {
    t.comment('The client brief of a style: the questionnaire the designer fills in with the client. One row per style, versioned.');
    t.uuid('style_id').primary().references('styles.id').onDelete('CASCADE').comment('The style the brief belongs to');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.jsonb('answers').notNullable().comment('The answers: customers, sport, level, climate, season, purpose, functional targets, colour intent and tones, target price, order by size, dates, constraints');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write; a stale write gets 409');
    t.uuid('updated_by').nullable().references('users.id').onDelete('SET NULL').comment('Who saved it last');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('First saved');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('Last saved');
    t.index(['studio_id'], 'briefs_studio_idx');
  });
  await knex.raw('alter table briefs add constraint briefs_version_positive check (version > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('briefs');
}
