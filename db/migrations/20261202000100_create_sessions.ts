import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.comment('Signed-in sessions. The sealed session cookie carries the id of a row here; a request is signed in only while its row exists, so deleting the row ends the session at once (sign-out, password change, deactivation).');
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()')).comment('Session id, carried in the sealed cookie');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE').comment('The account signed in');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now()).comment('When the account signed in');
    t.timestamp('expires_at', { useTz: true }).notNullable().comment('When the session ends by itself, as the cookie does; a row past it counts as signed out and is cleared at a later sign-in');
    t.text('user_agent').nullable().comment('The browser that signed in, as it named itself (first 300 characters); for the account page, never trusted');
    t.index(['user_id'], 'sessions_user_idx');
    t.index(['expires_at'], 'sessions_expires_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
