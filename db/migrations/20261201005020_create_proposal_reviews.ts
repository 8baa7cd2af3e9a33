import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('proposal_reviews', (t) => {
    t.comment('A client asked to approve a released revision, and their decision.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Review id');
    t.uuid('release_id').notNullable().references('releases.id').onDelete('CASCADE').comment('The released revision under review');
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE').comment('The client organisation asked');
    t.uuid('requested_by').nullable().references('users.id').onDelete('SET NULL').comment('Who asked');
    t.timestamp('requested_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('status').notNullable().defaultTo('pending').comment('pending, approved or changes-requested');
    t.uuid('decided_by').nullable().references('users.id').onDelete('SET NULL').comment('Who decided');
    t.timestamp('decided_at', { useTz: true }).nullable();
    t.text('decision_comment').notNullable().defaultTo('').comment('What the client said with the decision');
    t.unique(['release_id', 'organisation_id'], { indexName: 'proposal_reviews_release_org_unique' });
  });
  await knex.raw("alter table proposal_reviews add constraint proposal_reviews_status_check check (status in ('pending', 'approved', 'changes-requested'))");

  await knex.schema.createTable('proposal_comments', (t) => {
    t.comment('Comments on a released revision by the client and the studio.');
    t.bigIncrements('id').primary().comment('Comment id');
    t.uuid('release_id').notNullable().references('releases.id').onDelete('CASCADE').comment('The released revision');
    t.uuid('user_id').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.uuid('organisation_id').nullable().references('organisations.id').onDelete('SET NULL').comment('Author organisation; null for studio staff');
    t.text('body').notNullable().comment('The comment');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['release_id', 'created_at'], 'proposal_comments_release_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('proposal_comments');
  await knex.schema.dropTable('proposal_reviews');
}
