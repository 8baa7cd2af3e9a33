import type { Knex } from 'knex';

const points = [
  'chest-half', 'waist-half', 'bottom-half', 'body-length-hps', 'sleeve-length', 'across-shoulder', 'armhole',
  'hip-half', 'thigh-half', 'knee-half', 'calf-half', 'ankle-half', 'inseam', 'rise',
];
const pointList = points.map((p) => `'${p}'`).join(', ');

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('size_specs', (t) => {
    t.comment('The size spec of a style: its base size and fit settings. Points, girths and cut-and-sew entries hang off it.');
    t.uuid('style_id').primary().references('styles.id').onDelete('CASCADE').comment('The style (one spec per style)');
    t.text('base_size').notNullable().comment('The size the other sizes are graded from; one of the style size labels');
    t.uuid('base_texture_id').nullable().references('textures.id').onDelete('SET NULL')
      .comment('Texture whose relaxed density sets the needles; null means the first texture of the style');
    t.uuid('compression_texture_id').nullable().references('textures.id').onDelete('SET NULL')
      .comment('Texture whose force-extension test gives the compression estimate');
    t.specificType('cylinder_diameters_in', 'double precision[]').notNullable()
      .comment('Cylinder diameters available at the mill, inches, for the cylinder recommendation');
    t.jsonb('compression_target').notNullable()
      .comment('Target band: { level: mild, moderate or firm, bands: { level: { minMmHg, maxMmHg } } }');
    t.uuid('updated_by').nullable().references('users.id').onDelete('SET NULL').comment('Who saved it last');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("alter table size_specs add constraint size_specs_cylinders_check check (cardinality(cylinder_diameters_in) between 1 and 30)");

  await knex.schema.createTable('size_spec_points', (t) => {
    t.comment('One point of measure of a size spec: base-size value, grade rule per size step and tolerance, in cm.');
    t.uuid('style_id').notNullable().references('size_specs.style_id').onDelete('CASCADE').comment('The spec (style)');
    t.text('point').notNullable().comment('Point of measure key, e.g. chest-half, body-length-hps, inseam');
    t.integer('position').notNullable().comment('Row order in the sheet');
    t.double('base_cm').nullable().comment('Value at the base size, cm; null while not entered');
    t.double('grade_cm').notNullable().defaultTo(0).comment('Change per size step, cm, added going up the size range');
    t.double('tolerance_cm').notNullable().comment('Plus or minus tolerance, cm');
    t.primary(['style_id', 'point'], { constraintName: 'size_spec_points_pkey' });
  });
  await knex.raw(`alter table size_spec_points add constraint size_spec_points_point_check check (point in (${pointList}))`);
  await knex.raw('alter table size_spec_points add constraint size_spec_points_values_check check ((base_cm is null or base_cm > 0) and tolerance_cm >= 0)');

  await knex.schema.createTable('size_spec_overrides', (t) => {
    t.comment('A size whose value of a point is set by hand instead of graded from the base size.');
    t.uuid('style_id').notNullable().comment('The spec (style)');
    t.text('point').notNullable().comment('Point of measure key');
    t.text('size').notNullable().comment('Size label');
    t.double('value_cm').notNullable().comment('The value of this size, cm');
    t.primary(['style_id', 'point', 'size'], { constraintName: 'size_spec_overrides_pkey' });
    t.foreign(['style_id', 'point'], 'size_spec_overrides_point_fk').references(['style_id', 'point']).inTable('size_spec_points').onDelete('CASCADE');
  });
  await knex.raw('alter table size_spec_overrides add constraint size_spec_overrides_value_check check (value_cm > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('size_spec_overrides');
  await knex.schema.dropTable('size_spec_points');
  await knex.schema.dropTable('size_specs');
}
