import type { Knex } from 'knex';

/**
 * The repeat of a texture is capped where the chart editor and the validation cap it
 * (chartLimits in lib/library/chart.ts: 96 needles by 96 courses), not at 200. The routes never
 * stored a larger repeat, so every existing row passes the new check.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('alter table textures drop constraint textures_repeat_check');
  await knex.raw('alter table textures add constraint textures_repeat_check check (repeat_needles between 1 and 96 and repeat_courses between 1 and 96)');
  await knex.raw("comment on constraint textures_repeat_check on textures is 'A repeat is 1 to 96 needles by 1 to 96 courses, as in the chart editor'");
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table textures drop constraint textures_repeat_check');
  await knex.raw('alter table textures add constraint textures_repeat_check check (repeat_needles between 1 and 200 and repeat_courses between 1 and 200)');
}
