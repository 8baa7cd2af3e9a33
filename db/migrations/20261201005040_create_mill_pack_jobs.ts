import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mill_pack_jobs', (t) => {
    t.comment('Mill pack PDFs being built on the server, with their progress; the finished file is a row of files.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Job id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.uuid('release_id').nullable().references('releases.id').onDelete('CASCADE').comment('The release printed; null for the working copy');
    t.uuid('requested_by').nullable().references('users.id').onDelete('SET NULL').comment('Who asked for it');
    t.text('paper').notNullable().comment('a4 or letter');
    t.text('status').notNullable().defaultTo('queued').comment('queued, running, done or failed');
    t.integer('progress').notNullable().defaultTo(0).comment('Percent done, 0 to 100');
    t.text('step').notNullable().defaultTo('').comment('What is being built now');
    t.uuid('file_id').nullable().references('files.id').onDelete('SET NULL').comment('The finished PDF');
    t.integer('pages').nullable().comment('Pages of the finished PDF');
    t.text('error').notNullable().defaultTo('').comment('Why it failed, in words');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('finished_at', { useTz: true }).nullable();
    t.index(['style_id', 'created_at'], 'mill_pack_jobs_style_idx');
  });
  await knex.raw("alter table mill_pack_jobs add constraint mill_pack_jobs_status_check check (status in ('queued', 'running', 'done', 'failed'))");
  await knex.raw("alter table mill_pack_jobs add constraint mill_pack_jobs_paper_check check (paper in ('a4', 'letter'))");
  await knex.raw('alter table mill_pack_jobs add constraint mill_pack_jobs_progress_check check (progress between 0 and 100)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mill_pack_jobs');
}
