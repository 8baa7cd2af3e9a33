import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('test_knits', (t) => {
    t.comment('A test knit of one texture of a released revision by one mill: requested, knitted (photo and measured density), approved or change requested.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Test knit id');
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE').comment('The style');
    t.uuid('release_id').notNullable().references('releases.id').onDelete('CASCADE').comment('The released revision');
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE').comment('The mill that knits it');
    t.uuid('texture_id').notNullable().comment('Texture id as in the release snapshot');
    t.text('texture_name').notNullable().comment('Texture name as released');
    t.double('planned_wales_per_cm').notNullable().comment('Planned relaxed wales per cm');
    t.double('planned_courses_per_cm').notNullable().comment('Planned relaxed courses per cm');
    t.double('planned_gsm').nullable().comment('Planned areal density, g per square metre (estimate)');
    t.text('status').notNullable().defaultTo('requested').comment('requested, knitted, approved or change-requested');
    t.double('measured_wales_per_cm').nullable().comment('Measured wales per cm');
    t.double('measured_courses_per_cm').nullable().comment('Measured courses per cm');
    t.double('measured_gsm').nullable().comment('Measured g per square metre');
    t.text('mill_note').notNullable().defaultTo('').comment('What the mill says about the knit');
    t.uuid('photo_file_id').nullable().references('files.id').onDelete('SET NULL').comment('Photo of the knitted piece');
    t.boolean('flagged').notNullable().defaultTo(false).comment('A measured figure deviates from the plan past the studio threshold');
    t.uuid('requested_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('requested_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.uuid('knitted_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('knitted_at', { useTz: true }).nullable();
    t.uuid('decided_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('decided_at', { useTz: true }).nullable();
    t.text('decision_comment').notNullable().defaultTo('').comment('The designer comment with the decision');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.unique(['release_id', 'organisation_id', 'texture_id'], { indexName: 'test_knits_release_mill_texture_unique' });
    t.index(['organisation_id', 'status'], 'test_knits_org_status_idx');
    t.index(['style_id'], 'test_knits_style_idx');
  });
  await knex.raw("alter table test_knits add constraint test_knits_status_check check (status in ('requested', 'knitted', 'approved', 'change-requested'))");
  await knex.raw(
    'alter table test_knits add constraint test_knits_measured_check check ((measured_wales_per_cm is null or measured_wales_per_cm > 0) and (measured_courses_per_cm is null or measured_courses_per_cm > 0) and (measured_gsm is null or measured_gsm > 0))',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('test_knits');
}
