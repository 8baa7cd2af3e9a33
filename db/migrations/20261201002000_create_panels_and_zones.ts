import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('panels', (t) => {
    t.comment('One map of a garment part in stitch space (x needles, y courses), saved from the body map.');
    t.uuid('id').primary().comment('Id chosen by the editor');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE');
    t.integer('position').notNullable().comment('Order of the panels side by side');
    t.text('kind').notNullable().comment('front, back, sleeve-left, sleeve-right, leg-left, leg-right');
    t.text('name').notNullable();
    t.integer('width_needles').notNullable().comment('Panel width, needles');
    t.integer('height_courses').notNullable().comment('Panel height, courses');
    t.jsonb('knitted_area').notNullable().comment('Polygon of what the machine knits, [{x,y}] in stitches');
    t.jsonb('cut_outline').notNullable().comment('Polygon of the garment part kept after cutting');
    t.uuid('base_texture_id').nullable().comment('Texture where no zone lies; a textures row of the same studio');
    t.unique(['style_id', 'kind'], { indexName: 'panels_style_kind_unique' });
    t.index(['style_id', 'position'], 'panels_style_position_idx');
  });
  await knex.raw('alter table panels add constraint panels_size_check check (width_needles > 0 and height_courses > 0)');

  await knex.schema.createTable('zones', (t) => {
    t.comment('A texture zone painted on a panel: a polygon in stitch space with its texture and function.');
    t.uuid('id').primary().comment('Id chosen by the editor');
    t.uuid('panel_id').notNullable().references('panels.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.uuid('texture_id').notNullable().comment('A textures row of the same studio');
    t.text('fn').notNullable().comment('compression, ventilation, support, colour-block, hem, trim-area');
    t.integer('stack_order').notNullable().comment('Higher draws over lower');
    t.jsonb('polygon').notNullable().comment('[{x,y}] in needles and courses');
    t.index(['panel_id'], 'zones_panel_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('zones');
  await knex.schema.dropTable('panels');
}
