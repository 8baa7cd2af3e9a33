import type { Knex } from 'knex';
import type { SessionUser } from '../../lib/db/users';
import { createColourStandard } from '../../lib/db/colour-standards';
import { createColourway } from '../../lib/db/colourways';
import { decideLabDip, submitLabDip } from '../../lib/db/lab-dips';
import {
  colourStandardInputSchema, colourwayInputSchema, labDipDecisionSchema, labDipInputSchema, type ColourStandardInput,
} from '../../lib/validations/colour';

/**
 * Demo data: the colour work of the demo studio (runs after 01–03, looks its rows up by e-mail,
 * style code and yarn name). Colour standards, two colourways for HF27-101 — a two-tone of
 * polyamide and cationic-dyeable polyester in one garment-dyeing run, and a solid union shade —
 * and lab dips from the mill: one rejected, one approved, one awaiting the colour lead's decision.
 * Every name and every CIELAB value here is invented for the demo.
 */

const standards: ColourStandardInput[] = [
  {
    name: 'Fellside Navy', lab: { L: 24.5, a: 1.8, b: -21.6 }, source: 'client-agreed',
    notes: 'Agreed with the client on the knitted standard of 3 March. Dark: judged tighter than the studio default.',
    tolerance: { formula: 'cmc', l: 2, c: 1, max: 0.8 },
  },
  {
    name: 'Lichen Mineral', lab: { L: 58.2, a: -24.5, b: -4.8 }, source: 'measured',
    notes: 'Measured from the studio swatch card, three readings averaged.', tolerance: { formula: 'cmc', l: 2, c: 1, max: 1.0 },
  },
  {
    name: 'Heron Grey', lab: { L: 63, a: -0.8, b: -2.4 }, source: 'measured', notes: '', tolerance: { formula: 'cmc', l: 2, c: 1, max: 1.0 },
  },
  {
    name: 'Ember Signal', lab: { L: 62, a: 48, b: 62 }, source: 'client-agreed', notes: 'High-visibility accent for trail styles.',
    tolerance: { formula: 'cmc', l: 2, c: 1, max: 1.2 },
  },
  {
    name: 'Glacier Flash', lab: { L: 72, a: -48, b: -32 }, source: 'digital',
    notes: 'From the mood board; beyond what a screen shows, so the preview is clipped. Needs a physical standard.',
    tolerance: { formula: 'cmc', l: 2, c: 1, max: 1.0 },
  },
  {
    name: 'Chalk Ground', lab: { L: 88, a: -1.2, b: 4.5 }, source: 'measured', notes: '', tolerance: { formula: 'de2000', max: 1.0 },
  },
];

async function sessionUser(knex: Knex, email: string): Promise<SessionUser> {
  const u = await knex('users as u')
    .join('studios as s', 's.id', 'u.studio_id')
    .leftJoin('organisations as o', 'o.id', 'u.organisation_id')
    .where('u.email', email)
    .first('u.id', 'u.studio_id', 's.name as studio_name', 'u.organisation_id', 'o.name as organisation_name', 'u.email', 'u.name', 'u.role');
  if (!u) throw new Error(`Run 01_demo_studio first: no account ${email}.`);
  return {
    id: u.id, studioId: u.studio_id, studioName: u.studio_name, organisationId: u.organisation_id, organisationName: u.organisation_name,
    email: u.email, name: u.name, role: u.role,
  };
}

export async function seed(knex: Knex): Promise<void> {
  await knex.raw('truncate table lab_dips, colourway_targets, colourways, colour_standards restart identity cascade');
  await knex('audit_log').whereLike('action', 'colour-standard.%').orWhereLike('action', 'colourway.%').orWhereLike('action', 'lab-dip.%').del();

  const lead = await sessionUser(knex, 'colour@hollowfell.example');
  const mill = await sessionUser(knex, 'mill@quellmoor.example');

  // Through the colour schemas and data layer, so the demo data passes the same checks.
  const standardIds = new Map<string, string>();
  for (const s of standards) {
    const created = await createColourStandard(lead, colourStandardInputSchema.parse(s), knex);
    standardIds.set(s.name, created.id);
  }
  const standard = (name: string) => {
    const id = standardIds.get(name);
    if (!id) throw new Error(`Seed: no colour standard ${name}`);
    return id;
  };

  const ridge = await knex('styles').where({ studio_id: lead.studioId, code: 'HF27-101' }).first();
  if (!ridge) return;
  const yarnId = async (name: string) => {
    const row = await knex('yarns').where({ studio_id: lead.studioId, name }).whereNull('archived_at').first('id');
    if (!row) throw new Error(`Run 02_library first: no yarn ${name}.`);
    return row.id as string;
  };
  const pa78 = await yarnId('Polyamide 6.6 78/68 semi-dull');
  const pa44 = await yarnId('Polyamide 44/34 full-dull');
  const cd84 = await yarnId('Cationic-dyeable polyester 84/72');

  // The two-tone: one garment-dyeing run, acid dyes for the polyamide ground, cationic dyes for the
  // modified polyester of the colour-block jacquard.
  const twoTone = await createColourway(
    lead,
    ridge.id,
    colourwayInputSchema.parse({
      name: 'Navy / Lichen',
      notes: 'Main colourway for the client presentation. Ground and accent in one garment-dyeing run.',
      targets: [
        { name: 'Ground', yarnIds: [pa78, pa44], route: 'garment-dyed', colour: { source: 'standard', standardId: standard('Fellside Navy') } },
        { name: 'Accent', yarnIds: [cd84], route: 'garment-dyed', colour: { source: 'standard', standardId: standard('Lichen Mineral') } },
      ],
    }),
    knex,
  );
  await createColourway(
    lead,
    ridge.id,
    colourwayInputSchema.parse({
      name: 'Heron solid',
      notes: 'Union shade: polyamide and cationic polyester dyed to one grey.',
      targets: [
        { name: 'Body', yarnIds: [pa78, pa44, cd84], route: 'garment-dyed', colour: { source: 'standard', standardId: standard('Heron Grey') } },
      ],
    }),
    knex,
  );

  const ground = twoTone.targets.find((t) => t.name === 'Ground');
  const accent = twoTone.targets.find((t) => t.name === 'Accent');
  if (!ground || !accent) throw new Error('Seed: the two-tone colourway lost a target.');

  // The mill's lab dips (invented readings) and the colour lead's decisions.
  const first = await submitLabDip(
    mill,
    ridge.id,
    labDipInputSchema.parse({ targetId: ground.id, measured: { L: 25.1, a: 3.4, b: -20.2 }, comment: 'Dip A on the 78/68 ground, dyed at 98 °C.' }),
    knex,
  );
  await decideLabDip(
    lead,
    ridge.id,
    first.id,
    labDipDecisionSchema.parse({ version: first.version, decision: 'rejected', comment: 'Too red and a little light. Add blue, keep the depth.' }),
    knex,
  );
  const accentDip = await submitLabDip(
    mill,
    ridge.id,
    labDipInputSchema.parse({ targetId: accent.id, measured: { L: 58.5, a: -24.0, b: -5.1 }, comment: 'Dip A on the cationic polyester.' }),
    knex,
  );
  await decideLabDip(
    lead,
    ridge.id,
    accentDip.id,
    labDipDecisionSchema.parse({ version: accentDip.version, decision: 'approved', comment: 'Good under daylight and shop light.' }),
    knex,
  );
  await submitLabDip(
    mill,
    ridge.id,
    labDipInputSchema.parse({
      targetId: ground.id,
      readingsCsv: 'Reading,L*,a*,b*\n1,24.62,2.05,-21.18\n2,24.71,2.20,-21.02\n3,24.58,1.98,-21.30\n',
      comment: 'Dip B: bluer, as asked. Three readings, sample turned between them.',
    }),
    knex,
  );
}
