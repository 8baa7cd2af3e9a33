import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sample_corrections', (t) => {
    t.comment('A change to the size spec decided from a sample round; accepting it updates the spec.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Correction id');
    t.uuid('round_id').notNullable().references('sample_rounds.id').onDelete('CASCADE').comment('The round it came from');
    t.text('point').notNullable().comment('Point of measure key');
    t.text('size').notNullable().comment('Size label the new value is given for');
    t.double('from_cm').nullable().comment('Spec value of that size when proposed, and again when decided, cm');
    t.double('to_cm').notNullable().comment('New spec value, cm');
    t.text('scope').notNullable().comment('size: only this size; point: every size of the point moves by the same amount');
    t.text('reason').notNullable().defaultTo('').comment('Why');
    t.text('status').notNullable().defaultTo('proposed').comment('proposed, accepted or rejected');
    t.uuid('proposed_by').nullable().references('users.id').onDelete('SET NULL').comment('Who proposed it');
    t.timestamp('proposed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.uuid('decided_by').nullable().references('users.id').onDelete('SET NULL').comment('Who accepted or rejected it');
    t.timestamp('decided_at', { useTz: true }).nullable().comment('When it was decided');
    t.index(['round_id'], 'sample_corrections_round_idx');
  });
  await knex.raw("alter table sample_corrections add constraint sample_corrections_scope_check check (scope in ('size', 'point'))");
  await knex.raw("alter table sample_corrections add constraint sample_corrections_status_check check (status in ('proposed', 'accepted', 'rejected'))");
  await knex.raw('alter table sample_corrections add constraint sample_corrections_value_check check (to_cm > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_corrections');
}
