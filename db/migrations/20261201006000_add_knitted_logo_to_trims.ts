import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('trims', (t) => {
    t.double('detail_mm').nullable().comment('Knitted logo: the finest line or gap of the artwork, mm; null when not given or not a knitted logo');
  });
  await knex.raw('alter table trims drop constraint trims_kind_check');
  await knex.raw(
    "alter table trims add constraint trims_kind_check check (kind in ('heat-transfer', 'woven-label', 'printed-tag', 'care-label', 'knitted-logo'))",
  );
  await knex.raw('alter table trims drop constraint trims_method_check');
  await knex.raw("alter table trims add constraint trims_method_check check (method in ('heat-press', 'bonded', 'sewn', 'printed', 'knitted'))");
  // A knitted logo is knitted, and only a knitted logo is.
  await knex.raw("alter table trims add constraint trims_knitted_check check ((kind = 'knitted-logo') = (method = 'knitted'))");
  await knex.raw('alter table trims add constraint trims_detail_check check (detail_mm is null or (detail_mm > 0 and detail_mm <= 100))');
  await knex.raw("comment on column trims.kind is 'heat-transfer, woven-label, printed-tag, care-label or knitted-logo'");
  await knex.raw("comment on column trims.method is 'Application method: heat-press, bonded, sewn, printed, or knitted (a knitted logo)'");
}

export async function down(knex: Knex): Promise<void> {
  await knex('trims').where({ kind: 'knitted-logo' }).del();
  await knex.raw('alter table trims drop constraint trims_detail_check');
  await knex.raw('alter table trims drop constraint trims_knitted_check');
  await knex.raw('alter table trims drop constraint trims_method_check');
  await knex.raw("alter table trims add constraint trims_method_check check (method in ('heat-press', 'bonded', 'sewn', 'printed'))");
  await knex.raw('alter table trims drop constraint trims_kind_check');
  await knex.raw("alter table trims add constraint trims_kind_check check (kind in ('heat-transfer', 'woven-label', 'printed-tag', 'care-label'))");
  await knex.raw("comment on column trims.kind is 'heat-transfer, woven-label, printed-tag or care-label'");
  await knex.raw("comment on column trims.method is 'Application method: heat-press, bonded, sewn or printed'");
  await knex.schema.alterTable('trims', (t) => {
    t.dropColumn('detail_mm');
  });
}
