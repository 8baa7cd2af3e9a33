import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sample_rounds', (t) => {
    t.comment('A sample of a style that came back from the mill: proto, fit or pre-production, in one size.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Round id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.integer('round_no').notNullable().comment('1, 2, 3 in the order recorded, per style');
    t.text('kind').notNullable().comment('proto, fit or pre-production');
    t.text('size').notNullable().comment('Size label of the sample');
    t.date('received_on').nullable().comment('Day the sample arrived');
    t.text('notes').notNullable().defaultTo('').comment('Free notes on the sample');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Who recorded it');
    t.uuid('updated_by').nullable().references('users.id').onDelete('SET NULL').comment('Who changed it last');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['style_id', 'round_no'], { indexName: 'sample_rounds_style_no_unique' });
  });
  await knex.raw("alter table sample_rounds add constraint sample_rounds_kind_check check (kind in ('proto', 'fit', 'pre-production'))");

  await knex.schema.createTable('sample_measurements', (t) => {
    t.comment('What a sample measured at one point, with the spec and tolerance it was held against when recorded.');
    t.uuid('round_id').notNullable().references('sample_rounds.id').onDelete('CASCADE').comment('The round');
    t.text('point').notNullable().comment('Point of measure key');
    t.double('measured_cm').notNullable().comment('Measured value, cm');
    t.double('spec_cm').nullable().comment('The spec value of the sample size at the time, cm; null when the spec had none');
    t.double('tolerance_cm').notNullable().comment('Plus or minus tolerance at the time, cm');
    t.primary(['round_id', 'point'], { constraintName: 'sample_measurements_pkey' });
  });
  await knex.raw('alter table sample_measurements add constraint sample_measurements_value_check check (measured_cm > 0 and tolerance_cm >= 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_measurements');
  await knex.schema.dropTable('sample_rounds');
}
