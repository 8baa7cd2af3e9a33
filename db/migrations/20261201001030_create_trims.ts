import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('trims', (t) => {
    t.comment('Branding and label elements placed on a panel of a style: heat transfers, woven labels, printed tags, care labels.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Trim id');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.text('panel_kind').notNullable().comment('Panel it sits on: front, back, sleeve-left, sleeve-right, leg-left, leg-right');
    t.text('name').notNullable().defaultTo('').comment('What the trim is, e.g. neck logo');
    t.text('kind').notNullable().comment('heat-transfer, woven-label, printed-tag or care-label');
    t.text('method').notNullable().comment('Application method: heat-press, bonded, sewn or printed');
    t.double('temp_c').nullable().comment('Application temperature at the fabric, degrees Celsius (heat-applied methods)');
    t.jsonb('box').notNullable().comment('Placement box in stitch space: { x, y, width, height } in needles and courses from the top left of the panel');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['style_id'], 'trims_style_idx');
  });
  await knex.raw(
    "alter table trims add constraint trims_panel_kind_check check (panel_kind in ('front', 'back', 'sleeve-left', 'sleeve-right', 'leg-left', 'leg-right'))",
  );
  await knex.raw("alter table trims add constraint trims_kind_check check (kind in ('heat-transfer', 'woven-label', 'printed-tag', 'care-label'))");
  await knex.raw("alter table trims add constraint trims_method_check check (method in ('heat-press', 'bonded', 'sewn', 'printed'))");
  await knex.raw('alter table trims add constraint trims_temp_check check (temp_c is null or (temp_c >= 0 and temp_c <= 400))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('trims');
}
