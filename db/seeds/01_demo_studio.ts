import type { Knex } from 'knex';
import bcrypt from 'bcryptjs';

/**
 * Demo data: an invented studio, its mills and clients, one account per role, and styles across
 * statuses and garment types. Every name here is invented for the demo.
 */
export const demoPassword = 'knit-demo-2027';

export const demoAccounts = [
  { email: 'admin@hollowfell.example', name: 'Wren Halloway', role: 'admin' },
  { email: 'designer@hollowfell.example', name: 'Tamsin Orlo', role: 'designer' },
  { email: 'colour@hollowfell.example', name: 'Iona Vesk', role: 'colour-lead' },
  { email: 'client@varrow.example', name: 'Piet Marrow', role: 'client', org: 'Varrow Sport' },
  { email: 'mill@quellmoor.example', name: 'Sunniva Brask', role: 'mill', org: 'Quellmoor Knitworks' },
] as const;

const circular14 = { kind: 'circular', diameterIn: 14, gauge: 28, needleMultiple: 4, feeders: 8, maxYarns: 3 };
const circular13 = { kind: 'circular', diameterIn: 13, gauge: 28, needleMultiple: 4, feeders: 8, maxYarns: 3 };
const flat14 = { kind: 'flat', gauge: 14, bedNeedles: 1000, maxYarns: 6 };
const topSizes = { labels: ['XS', 'S', 'M', 'L', 'XL'], base: 'M' };
const bottomSizes = { labels: ['XS', 'S', 'M', 'L'], base: 'S' };

export async function seed(knex: Knex): Promise<void> {
  await knex.raw('truncate table audit_log, style_shares, styles, sign_in_attempts, users, organisations, studios restart identity cascade');

  const hash = await bcrypt.hash(demoPassword, 10);
  const [studio] = await knex('studios')
    .insert({ name: 'Hollowfell Knit Lab', settings: JSON.stringify({ labDipTolerance: { formula: 'cmc', l: 2, c: 1, max: 1.0 } }) })
    .returning('id');
  const studioId = (studio as { id: string }).id;

  const orgs = await knex('organisations')
    .insert([
      { studio_id: studioId, kind: 'mill', name: 'Quellmoor Knitworks', contact_emails: ['programming@quellmoor.example', 'mill@quellmoor.example'] },
      { studio_id: studioId, kind: 'mill', name: 'Brannock Flat Knitting', contact_emails: ['studio-desk@brannock.example'] },
      { studio_id: studioId, kind: 'client', name: 'Varrow Sport', contact_emails: ['client@varrow.example'] },
      { studio_id: studioId, kind: 'client', name: 'Kestenholm Outdoor', contact_emails: ['product@kestenholm.example'] },
    ])
    .returning(['id', 'name']);
  const org = (name: string) => (orgs as { id: string; name: string }[]).find((o) => o.name === name)!.id;

  const users = await knex('users')
    .insert(
      demoAccounts.map((a) => ({
        studio_id: studioId,
        email: a.email,
        name: a.name,
        role: a.role,
        password_hash: hash,
        organisation_id: 'org' in a ? org(a.org) : null,
      })),
    )
    .returning(['id', 'role']);
  const designerId = (users as { id: string; role: string }[]).find((u) => u.role === 'designer')!.id;

  const styles: Array<{ code: string; name: string; season: string; client: string | null; type: string; construction: string; machine: object; sizes: object; status: string; revision: number; shares: string[] }> = [
    { code: 'HF27-101', name: 'Ridge compression long sleeve', season: 'SS27', client: 'Varrow Sport', type: 'long-sleeve-top', construction: 'seamless', machine: circular14, sizes: topSizes, status: 'released', revision: 3, shares: ['Quellmoor Knitworks'] },
    { code: 'HF27-102', name: 'Updraft running tank', season: 'SS27', client: 'Varrow Sport', type: 'tank', construction: 'seamless', machine: circular13, sizes: topSizes, status: 'client-review', revision: 2, shares: [] },
    { code: 'HF27-103', name: 'Contour support legging', season: 'AW27', client: 'Kestenholm Outdoor', type: 'legging', construction: 'seamless', machine: circular13, sizes: bottomSizes, status: 'developing', revision: 1, shares: [] },
    { code: 'HF27-104', name: 'Stillwater low-impact bra', season: 'AW27', client: 'Varrow Sport', type: 'sports-bra', construction: 'seamless', machine: circular13, sizes: topSizes, status: 'draft', revision: 1, shares: [] },
    { code: 'HF27-105', name: 'Switchback trail shorts', season: 'SS27', client: 'Kestenholm Outdoor', type: 'shorts', construction: 'seamless', machine: circular14, sizes: bottomSizes, status: 'sampling', revision: 2, shares: ['Quellmoor Knitworks'] },
    { code: 'HF27-106', name: 'Harbour fashioned tee', season: 'SS27', client: null, type: 'short-sleeve-top', construction: 'flat', machine: flat14, sizes: topSizes, status: 'developing', revision: 1, shares: [] },
    { code: 'HF26-118', name: 'Tideline base layer', season: 'AW26', client: 'Kestenholm Outdoor', type: 'long-sleeve-top', construction: 'seamless', machine: circular14, sizes: topSizes, status: 'production-ready', revision: 5, shares: ['Quellmoor Knitworks'] },
  ];

  for (const s of styles) {
    const [row] = await knex('styles')
      .insert({
        studio_id: studioId, code: s.code, name: s.name, season: s.season, client_id: s.client ? org(s.client) : null,
        garment_type: s.type, construction: s.construction, machine: JSON.stringify(s.machine), sizes: JSON.stringify(s.sizes),
        status: s.status, revision: s.revision, created_by: designerId,
      })
      .returning('id');
    const styleId = (row as { id: string }).id;
    const shareOrgs = [...(s.client ? [s.client] : []), ...s.shares];
    for (const name of shareOrgs) {
      await knex('style_shares').insert({ style_id: styleId, organisation_id: org(name), shared_by: designerId });
    }
    await knex('audit_log').insert({ studio_id: studioId, style_id: styleId, user_id: designerId, action: 'style.create', details: JSON.stringify({ code: s.code, name: s.name }) });
  }

  // A second, unrelated studio: its data must never show up for the first one.
  const [other] = await knex('studios').insert({ name: 'Oxbow Knit Collective' }).returning('id');
  const otherId = (other as { id: string }).id;
  const [otherAdmin] = await knex('users')
    .insert({ studio_id: otherId, email: 'admin@oxbow.example', name: 'Rafe Oxley', role: 'admin', password_hash: hash })
    .returning('id');
  await knex('styles').insert({
    studio_id: otherId, code: 'OX-001', name: 'Oxbow private sample', season: 'SS27', garment_type: 'tank', construction: 'seamless',
    machine: JSON.stringify(circular13), sizes: JSON.stringify(topSizes), status: 'draft', created_by: (otherAdmin as { id: string }).id,
  });
}
