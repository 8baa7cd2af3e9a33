import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw('create extension if not exists pgcrypto');

  await knex.schema.createTable('studios', (t) => {
    t.comment('A design studio: the tenant. Nobody sees data of another studio.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Studio id');
    t.text('name').notNullable().comment('Display name');
    t.jsonb('settings').notNullable().defaultTo('{}').comment('Studio-wide settings: tolerances, factors');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('organisations', (t) => {
    t.comment('Outside parties a studio works with: the mills that knit and the clients who review.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Owning studio');
    t.text('kind').notNullable().comment('mill or client');
    t.text('name').notNullable().comment('Display name');
    t.specificType('contact_emails', 'text[]').notNullable().defaultTo('{}').comment('Who receives e-mails');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['studio_id', 'kind', 'name'], { indexName: 'organisations_studio_kind_name_unique' });
  });
  await knex.raw(
    "alter table organisations add constraint organisations_kind_check check (kind in ('mill', 'client'))",
  );

  await knex.schema.createTable('users', (t) => {
    t.comment('People who sign in. Mill and client accounts belong to an organisation of the studio.');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('studio_id').notNullable().references('studios.id').onDelete('CASCADE').comment('Tenant');
    t.uuid('organisation_id').nullable().references('organisations.id').onDelete('SET NULL')
      .comment('Mill or client organisation for outside accounts; null for studio staff');
    t.text('email').notNullable().comment('Sign-in e-mail, stored lower-case');
    t.text('name').notNullable().comment('Display name');
    t.text('password_hash').notNullable().comment('bcrypt hash');
    t.text('role').notNullable().comment('admin, designer, colour-lead, client, mill');
    t.boolean('active').notNullable().defaultTo(true).comment('Deactivated accounts cannot sign in');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['email'], { indexName: 'users_email_unique' });
    t.index(['studio_id'], 'users_studio_idx');
  });
  await knex.raw(
    "alter table users add constraint users_role_check check (role in ('admin', 'designer', 'colour-lead', 'client', 'mill'))",
  );
  await knex.raw(
    "alter table users add constraint users_outside_has_org check (role not in ('client', 'mill') or organisation_id is not null)",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
  await knex.schema.dropTable('organisations');
  await knex.schema.dropTable('studios');
}
