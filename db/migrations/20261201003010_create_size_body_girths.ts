import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('size_body_girths', (t) => {
    t.comment('The body each size of a style is meant for: girths in cm, for the compression estimate.');
    t.uuid('style_id').notNullable().references('size_specs.style_id').onDelete('CASCADE').comment('The spec (style)');
    t.text('size').notNullable().comment('Size label');
    t.text('girth').notNullable().comment('chest, waist, hip, thigh or calf');
    t.double('value_cm').notNullable().comment('Body girth, cm');
    t.primary(['style_id', 'size', 'girth'], { constraintName: 'size_body_girths_pkey' });
  });
  await knex.raw("alter table size_body_girths add constraint size_body_girths_girth_check check (girth in ('chest', 'waist', 'hip', 'thigh', 'calf'))");
  await knex.raw('alter table size_body_girths add constraint size_body_girths_value_check check (value_cm > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('size_body_girths');
}
