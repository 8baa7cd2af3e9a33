import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('styles', (t) => {
    t.comment('One garment design of a studio.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.text('code').notNullable().comment('Style code, unique within the studio');
    t.text('name').notNullable().comment('Style name');
    t.text('season').notNullable().defaultTo('').comment('Season, e.g. SS27');
    t.uuid('client_id').nullable().references('organisations.id').onDelete('SET NULL').comment('Client organisation');
    t.text('garment_type').notNullable().comment('long-sleeve-top, short-sleeve-top, tank, sports-bra, legging, shorts');
    t.text('construction').notNullable().comment('seamless (circular) or flat (V-bed)');
    t.jsonb('machine').notNullable().comment('Machine setup: cylinder/gauge/needles/feeders or flat gauge/bed width');
    t.jsonb('sizes').notNullable().comment('Size range: { labels: string[], base: string }');
    t.text('status').notNullable().defaultTo('draft').comment('Workflow status');
    t.integer('revision').notNullable().defaultTo(1).comment('Revision shown on exports; raised on release');
    t.integer('version').notNullable().defaultTo(1).comment('Optimistic concurrency: raised on every write');
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL').comment('Author');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('archived_at', { useTz: true }).nullable().comment('Set when archived; archived styles are hidden');
    t.unique(['studio_id', 'code'], { indexName: 'styles_studio_code_unique' });
    t.index(['studio_id', 'updated_at'], 'styles_studio_updated_idx');
  });
  await knex.raw(
    "alter table styles add constraint styles_construction_check check (construction in ('seamless', 'flat'))",
  );
  await knex.raw(
    "alter table styles add constraint styles_status_check check (status in ('draft', 'developing', 'client-review', 'released', 'sampling', 'production-ready'))",
  );
  await knex.raw(
    "alter table styles add constraint styles_garment_type_check check (garment_type in ('long-sleeve-top', 'short-sleeve-top', 'tank', 'sports-bra', 'legging', 'shorts'))",
  );

  await knex.schema.createTable('style_shares', (t) => {
    t.comment('Which client or mill organisation may see which style.');
    t.uuid('style_id').notNullable().references('styles.id').onDelete('CASCADE');
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE');
    t.uuid('shared_by').nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['style_id', 'organisation_id'], { constraintName: 'style_shares_pkey' });
    t.index(['organisation_id'], 'style_shares_org_idx');
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.comment('Who did what to which style, when, with details. Append-only.');
    t.bigIncrements('id').primary();
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE');
    t.uuid('style_id').nullable().references('styles.id').onDelete('CASCADE');
    t.uuid('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.text('action').notNullable().comment('e.g. style.create, style.update, body-map.save');
    t.jsonb('details').notNullable().defaultTo('{}').comment('What changed');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['style_id', 'created_at'], 'audit_log_style_idx');
    t.index(['studio_id', 'created_at'], 'audit_log_studio_idx');
  });

  await knex.schema.createTable('sign_in_attempts', (t) => {
    t.comment('Failed sign-ins per account and per address, counted in windows (rate limiting across app servers).');
    t.text('key').notNullable().comment('email:<address> or ip:<address>');
    t.timestamp('window_start', { useTz: true }).notNullable();
    t.integer('failures').notNullable().defaultTo(0);
    t.primary(['key', 'window_start'], { constraintName: 'sign_in_attempts_pkey' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_in_attempts');
  await knex.schema.dropTable('audit_log');
  await knex.schema.dropTable('style_shares');
  await knex.schema.dropTable('styles');
}
