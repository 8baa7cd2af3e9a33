import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lab_dips', (t) => {
    t.comment('A dyed sample sent for a colourway target: its measured colour, the target it was judged against, and the decision.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Lab dip id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style, for scoping and its history');
    t.uuid('colourway_id').notNullable().references('colourways.id').onDelete('CASCADE').comment('The colourway');
    t.uuid('target_id').notNullable().references('colourway_targets.id').onDelete('CASCADE').comment('The target it matches');
    t.integer('sequence').notNullable().comment('1 for the first dip sent for the target, then 2, 3 and so on');
    t.uuid('organisation_id').nullable().references('organisations.id').onDelete('SET NULL').comment('Mill organisation of the submitter; null when studio staff entered it');
    t.uuid('submitted_by').nullable().references('users.id').onDelete('SET NULL').comment('Who submitted it');
    t.timestamp('submitted_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was submitted');
    t.jsonb('readings').notNullable().comment('Instrument readings as entered: [{ L, a, b }] CIELAB D65/10');
    t.double('lab_l').notNullable().comment('Measured CIELAB L*: the mean of the readings');
    t.double('lab_a').notNullable().comment('Measured CIELAB a*: the mean of the readings');
    t.double('lab_b').notNullable().comment('Measured CIELAB b*: the mean of the readings');
    t.jsonb('target_lab').notNullable().comment('The target colour { L, a, b } at submission, kept so the judgement can be read again');
    t.jsonb('tolerance').notNullable().comment('The tolerance at submission: { formula, l, c, max }');
    t.text('comment').notNullable().defaultTo('').comment('Comment of the submitter');
    t.text('status').notNullable().defaultTo('submitted').comment('submitted, approved or rejected');
    t.uuid('decided_by').nullable().references('users.id').onDelete('SET NULL').comment('Colour lead or admin who decided');
    t.timestamp('decided_at', { useTz: true }).nullable().comment('When it was decided');
    t.text('decision_comment').notNullable().defaultTo('').comment('Comment with the decision');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.unique(['target_id', 'sequence'], { indexName: 'lab_dips_target_sequence_unique' });
    t.index(['style_id', 'submitted_at'], 'lab_dips_style_idx');
    t.index(['colourway_id'], 'lab_dips_colourway_idx');
  });
  await knex.raw("alter table lab_dips add constraint lab_dips_status_check check (status in ('submitted', 'approved', 'rejected'))");
  await knex.raw("alter table lab_dips add constraint lab_dips_decided_check check ((status = 'submitted') = (decided_at is null))");
  await knex.raw('alter table lab_dips add constraint lab_dips_lab_range check (lab_l >= 0 and lab_l <= 100 and lab_a between -128 and 128 and lab_b between -128 and 128)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('lab_dips');
}
