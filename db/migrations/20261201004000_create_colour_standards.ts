import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('colour_standards', (t) => {
    t.comment('Named colours of the studio library with their CIELAB values (D65, 10 degree observer) and acceptance tolerance.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Colour standard id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Owning studio (tenant)');
    t.text('name').notNullable().comment('Display name, unique among the active standards of the studio');
    t.double('lab_l').notNullable().comment('CIELAB L* (D65/10), 0 to 100');
    t.double('lab_a').notNullable().comment('CIELAB a* (D65/10)');
    t.double('lab_b').notNullable().comment('CIELAB b* (D65/10)');
    t.text('source').notNullable().comment('measured, client-agreed or digital: where the values come from');
    t.text('notes').notNullable().defaultTo('').comment('Free notes: the physical standard, who agreed it');
    t.text('tolerance_formula').notNullable().defaultTo('cmc').comment('cmc for CMC(l:c) or de2000 for CIEDE2000');
    t.double('tolerance_l').nullable().defaultTo(2).comment('CMC lightness weight l; null for de2000');
    t.double('tolerance_c').nullable().defaultTo(1).comment('CMC chroma weight c; null for de2000');
    t.double('tolerance_max').notNullable().defaultTo(1).comment('Largest colour difference still accepted for a lab dip');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was added');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When it was last changed');
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when archived; archived standards are hidden from the library but still read by targets');
    t.index(['studio_id', 'archived_at'], 'colour_standards_studio_archived_idx');
  });
  await knex.raw('create unique index colour_standards_studio_name_active_unique on colour_standards (studio_id, lower(name)) where archived_at is null');
  await knex.raw('alter table colour_standards add constraint colour_standards_lab_range check (lab_l >= 0 and lab_l <= 100 and lab_a between -128 and 128 and lab_b between -128 and 128)');
  await knex.raw("alter table colour_standards add constraint colour_standards_source_check check (source in ('measured', 'client-agreed', 'digital'))");
  await knex.raw("alter table colour_standards add constraint colour_standards_tolerance_check check ((tolerance_formula = 'cmc' and tolerance_l > 0 and tolerance_c > 0) or (tolerance_formula = 'de2000' and tolerance_l is null and tolerance_c is null))");
  await knex.raw('alter table colour_standards add constraint colour_standards_tolerance_max_check check (tolerance_max > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('colour_standards');
}
