import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (t) => {
    t.jsonb('settings').notNullable().defaultTo('{}').comment('Studio-side settings of the organisation; for a mill, costing.machineMinuteRate (the machine-minute rate the mill charges). Studio staff only.');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (t) => {
    t.dropColumn('settings');
  });
}
