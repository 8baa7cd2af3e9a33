import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('textures', (t) => {
    t.comment('Knit structures in the studio library: a stitch repeat, its feeders, relaxed density and loop lengths.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Texture id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Owning studio (tenant)');
    t.text('name').notNullable().comment('Display name, unique among the active textures of the studio');
    t.text('family').notNullable().comment('Structure family: jersey, mock-rib, rib-like, mesh, pique, float-jacquard, terry');
    t.text('function').nullable().comment('Intended function: compression, ventilation, support, colour-block; null for a general ground');
    t.integer('repeat_needles').notNullable().comment('Repeat width, needles');
    t.integer('repeat_courses').notNullable().comment('Repeat height, courses');
    t.specificType('cells', 'text[]').notNullable().comment('Stitch chart: one string per course, course 1 first knitted, one letter per needle (k knit, t tuck, m miss)');
    t.jsonb('feeders').notNullable().comment('One feeder per course: [{ ground: yarn id, plated?: { yarn: yarn id, draft } }]; yarns of the same studio');
    t.double('gauge').notNullable().defaultTo(28).comment('Machine gauge the texture was developed on, needles per inch (float lengths and miss yarn)');
    t.double('wales_per_cm').notNullable().comment('Relaxed density, wales per cm');
    t.double('courses_per_cm').notNullable().comment('Relaxed density, courses per cm');
    t.double('loop_knit_mm').notNullable().comment('Yarn length of a knit loop, mm');
    t.double('loop_tuck_mm').notNullable().comment('Yarn length of a tuck loop, mm');
    t.jsonb('force_extension').nullable().comment('Fabric test points along the girth: [{ extension (fraction), tensionNPerCm }]; null when not tested');
    t.text('notes').notNullable().defaultTo('').comment('Free notes for the designer and the mill');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when archived; archived textures are hidden from the library');
    t.index(['studio_id', 'archived_at'], 'textures_studio_archived_idx');
  });
  await knex.raw('create unique index textures_studio_name_active_unique on textures (studio_id, lower(name)) where archived_at is null');
  await knex.raw(
    "alter table textures add constraint textures_family_check check (family in ('jersey', 'mock-rib', 'rib-like', 'mesh', 'pique', 'float-jacquard', 'terry'))",
  );
  await knex.raw(
    "alter table textures add constraint textures_function_check check (\"function\" is null or \"function\" in ('compression', 'ventilation', 'support', 'colour-block'))",
  );
  await knex.raw('alter table textures add constraint textures_repeat_check check (repeat_needles between 1 and 200 and repeat_courses between 1 and 200)');
  await knex.raw(
    "alter table textures add constraint textures_cells_shape check (array_length(cells, 1) = repeat_courses and length(array_to_string(cells, '')) = repeat_needles * repeat_courses and array_to_string(cells, '') ~ '^[ktm]+$')",
  );
  await knex.raw("alter table textures add constraint textures_feeders_shape check (jsonb_typeof(feeders) = 'array' and jsonb_array_length(feeders) = repeat_courses)");
  await knex.raw(
    'alter table textures add constraint textures_positive check (gauge > 0 and wales_per_cm > 0 and courses_per_cm > 0 and loop_knit_mm > 0 and loop_tuck_mm > 0)',
  );
  // Looks up the textures whose feeders use a yarn (archiving a yarn checks it).
  await knex.raw('create index textures_feeders_gin on textures using gin (feeders jsonb_path_ops)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('textures');
}
