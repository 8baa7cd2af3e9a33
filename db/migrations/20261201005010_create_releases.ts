import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('releases', (t) => {
    t.comment('A revision of a style released to mills: the frozen snapshot of what was released, viewable as it was.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Release id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.integer('revision').notNullable().comment('The revision number released');
    t.jsonb('snapshot').notNullable().comment('Everything the exports are made from, as released (lib/mill/pack-data PackData)');
    t.text('note').notNullable().defaultTo('').comment('Note to the mills');
    t.uuid('released_by').nullable().references('users.id').onDelete('SET NULL').comment('Who released it');
    t.timestamp('released_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When');
    t.unique(['style_id', 'revision'], { indexName: 'releases_style_revision_unique' });
    t.index(['studio_id', 'released_at'], 'releases_studio_idx');
  });
  await knex.raw('alter table releases add constraint releases_revision_check check (revision >= 1)');

  await knex.schema.createTable('release_mills', (t) => {
    t.comment('Which mills a release was sent to.');
    t.uuid('release_id').notNullable().references('releases.id').onDelete('CASCADE').comment('The release');
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE').comment('A mill of the studio');
    t.primary(['release_id', 'organisation_id'], { constraintName: 'release_mills_pkey' });
    t.index(['organisation_id'], 'release_mills_org_idx');
  });

  await knex.schema.alterTable('files', (t) => {
    t.foreign('release_id', 'files_release_fk').references('releases.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('files', (t) => {
    t.dropForeign('release_id', 'files_release_fk');
  });
  await knex.schema.dropTable('release_mills');
  await knex.schema.dropTable('releases');
}
