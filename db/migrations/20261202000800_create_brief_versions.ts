import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('brief_versions', (t) => {
    t.comment('Every saved state of a style brief: the full answers as saved, who saved them and when. Studio staff read it (answers hold prices).');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Version row id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style whose brief this is a saved state of');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.integer('version').notNullable().comment('The brief version this save produced');
    t.jsonb('answers').notNullable().comment('The full answers as saved, prices included');
    t.uuid('saved_by').nullable().references('users.id').onDelete('SET NULL').comment('Who saved this version');
    t.timestamp('saved_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When this version was saved');
    t.unique(['style_id', 'version'], { indexName: 'brief_versions_style_version_unique' });
    t.index(['studio_id'], 'brief_versions_studio_idx');
  });
  // The briefs saved so far start their history with their current answers.
  await knex.raw(`
    insert into brief_versions (style_id, studio_id, version, answers, saved_by, saved_at)
    select style_id, studio_id, version, answers, updated_by, updated_at from briefs
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('brief_versions');
}
