import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('yarns', (t) => {
    t.comment('Yarns as bought, in the studio library. Textures reference them from their feeders.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Yarn id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Owning studio (tenant)');
    t.text('name').notNullable().comment('Display name, unique among the active yarns of the studio');
    t.text('supplier_ref').notNullable().defaultTo('').comment('Supplier article reference');
    t.double('dtex').notNullable().comment('Linear density as bought, dtex (resultant; computed from core and cover for covered yarns)');
    t.text('count_unit').notNullable().defaultTo('dtex').comment('Unit the count was entered in (tex, dtex, den, Nm, Ne), for showing it back');
    t.integer('filaments').nullable().comment('Filament count; null for spun or unknown');
    t.text('lustre').nullable().comment('bright, semi-dull or full-dull; null where it does not apply');
    t.boolean('staple').notNullable().defaultTo(false).comment('Spun from staple fibre rather than filament (EU allowance of polyamide)');
    t.jsonb('make_up').notNullable().comment('Fibre make-up as entered: single fibre, blend with shares, or covered elastane (core dtex and draft, cover dtex and take-up)');
    t.jsonb('fibres').notNullable().comment('Resulting fibre shares by mass: [{ fibre, share }] with shares summing to 1');
    t.text('colour_state').notNullable().defaultTo('dyeable').comment('dyeable, dope-dyed or yarn-dyed');
    t.jsonb('colour_lab').nullable().comment('CIELAB D65/10 colour { L, a, b } of a dope-dyed or yarn-dyed yarn; null when dyeable');
    t.decimal('price_per_kg', 10, 2).nullable().comment('Price per kg in the studio currency');
    t.double('recycled_share').nullable().comment('Share of recycled content by mass, 0 to 1');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when archived; archived yarns are hidden from the library');
    t.index(['studio_id', 'archived_at'], 'yarns_studio_archived_idx');
  });
  await knex.raw('create unique index yarns_studio_name_active_unique on yarns (studio_id, lower(name)) where archived_at is null');
  await knex.raw('alter table yarns add constraint yarns_dtex_positive check (dtex > 0)');
  await knex.raw('alter table yarns add constraint yarns_filaments_positive check (filaments is null or filaments > 0)');
  await knex.raw("alter table yarns add constraint yarns_count_unit_check check (count_unit in ('tex', 'dtex', 'den', 'Nm', 'Ne'))");
  await knex.raw("alter table yarns add constraint yarns_lustre_check check (lustre is null or lustre in ('bright', 'semi-dull', 'full-dull'))");
  await knex.raw("alter table yarns add constraint yarns_colour_state_check check (colour_state in ('dyeable', 'dope-dyed', 'yarn-dyed'))");
  await knex.raw("alter table yarns add constraint yarns_colour_lab_present check ((colour_state = 'dyeable') = (colour_lab is null))");
  await knex.raw('alter table yarns add constraint yarns_price_check check (price_per_kg is null or price_per_kg >= 0)');
  await knex.raw('alter table yarns add constraint yarns_recycled_share_check check (recycled_share is null or (recycled_share >= 0 and recycled_share <= 1))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('yarns');
}
