import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('colourway_targets', (t) => {
    t.comment('A target colour of a colourway for a group of yarns: CIELAB entered or a studio colour standard, and its dye route.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Target id; lab dips refer to it');
    t.uuid('colourway_id').notNullable().references('colourways.id').onDelete('CASCADE').comment('The colourway');
    t.integer('position').notNullable().defaultTo(0).comment('Order within the colourway');
    t.text('name').notNullable().comment('Display name, e.g. Ground or Accent');
    t.specificType('yarn_ids', 'uuid[]').notNullable().comment('Yarns of the studio library this target colours; a yarn takes at most one target per colourway');
    t.text('route').notNullable().comment('garment-dyed, yarn-dyed or dope-dyed');
    t.uuid('standard_id').nullable().references('colour_standards.id').onDelete('RESTRICT').comment('The colour standard the target follows; null when CIELAB values are entered');
    t.double('lab_l').nullable().comment('Entered CIELAB L* (D65/10); null when a standard is used');
    t.double('lab_a').nullable().comment('Entered CIELAB a* (D65/10); null when a standard is used');
    t.double('lab_b').nullable().comment('Entered CIELAB b* (D65/10); null when a standard is used');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was added');
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when removed from the colourway while lab dips refer to it');
    t.index(['colourway_id', 'position'], 'colourway_targets_colourway_idx');
    t.index(['standard_id'], 'colourway_targets_standard_idx');
  });
  await knex.raw("alter table colourway_targets add constraint colourway_targets_route_check check (route in ('garment-dyed', 'yarn-dyed', 'dope-dyed'))");
  await knex.raw('alter table colourway_targets add constraint colourway_targets_yarns_present check (cardinality(yarn_ids) > 0)');
  await knex.raw(
    'alter table colourway_targets add constraint colourway_targets_colour_source check ((standard_id is null) = (lab_l is not null and lab_a is not null and lab_b is not null))',
  );
  await knex.raw('alter table colourway_targets add constraint colourway_targets_lab_range check (lab_l is null or (lab_l >= 0 and lab_l <= 100 and lab_a between -128 and 128 and lab_b between -128 and 128))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('colourway_targets');
}
