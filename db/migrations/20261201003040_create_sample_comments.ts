import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sample_comments', (t) => {
    t.comment('Comments on a sample round, in the order written. Append-only.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Comment id');
    t.uuid('round_id').notNullable().references('sample_rounds.id').onDelete('CASCADE').comment('The round');
    t.uuid('user_id').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.text('body').notNullable().comment('The comment');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['round_id', 'created_at'], 'sample_comments_round_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_comments');
}
