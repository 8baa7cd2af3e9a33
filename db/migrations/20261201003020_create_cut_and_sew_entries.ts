import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('cut_and_sew_entries', (t) => {
    t.comment('Cut-and-sew half-widths the designer knows fit; shown beside their seamless equivalent by the studio factor.');
    t.uuid('style_id').notNullable().references('size_specs.style_id').onDelete('CASCADE').comment('The spec (style)');
    t.text('point').notNullable().comment('Point of measure key (a half-width)');
    t.text('size').notNullable().comment('Size label');
    t.double('value_cm').notNullable().comment('Cut-and-sew half-width, cm');
    t.primary(['style_id', 'point', 'size'], { constraintName: 'cut_and_sew_entries_pkey' });
  });
  await knex.raw('alter table cut_and_sew_entries add constraint cut_and_sew_entries_value_check check (value_cm > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('cut_and_sew_entries');
}
