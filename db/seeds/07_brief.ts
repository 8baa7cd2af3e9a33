import type { Knex } from 'knex';
import type { SessionUser } from '../../lib/db/users';
import { saveBrief } from '../../lib/db/briefs';
import { saveQuoteInputs } from '../../lib/db/quotes';
import { briefAnswersSchema } from '../../lib/validations/brief';
import { quoteInputsSchema } from '../../lib/validations/quote';

/**
 * Demo data: the client brief of the compression long sleeve (HF27-101) and its quote entries.
 * Every value is invented. The reference board stays empty (its images live in the object store).
 */

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
  await knex.raw('truncate table brief_references, brief_versions, briefs, quotes');
  await knex('files').where({ purpose: 'brief-reference' }).del();
  await knex('audit_log').whereLike('action', 'brief.%').orWhereLike('action', 'quote.%').del();

  const designer = await sessionUser(knex, 'designer@hollowfell.example');
  const style = await knex('styles').where({ studio_id: designer.studioId, code: 'HF27-101' }).first('id', 'sizes');
  if (!style) throw new Error('Seed: no style HF27-101.');
  const sizes = (style.sizes as { labels: string[] }).labels;
  const orderBySize: Record<string, number> = {};
  const split = [0.12, 0.26, 0.3, 0.22, 0.1];
  sizes.forEach((s, i) => { orderBySize[s] = Math.round(1200 * (split[i] ?? 0.1) / 10) * 10; });

  await saveBrief(designer, style.id, {
    version: 0,
    answers: briefAnswersSchema.parse({
      customers: 'Trail and mountain runners of the client web shop, mostly training five days a week',
      sport: 'Trail running', level: 'competitive', climate: 'temperate', season: 'SS27',
      purpose: 'A long-sleeve base layer for long climbs: firm hold on the torso sides, cool under the arms and down the back.',
      compression: 'moderate', ventilationAreas: 'Underarms, centre back', support: 'medium', stretch: 'four-way',
      weightUnit: 'gsm', weightTarget: 185, care: 'Machine wash at 30, no tumble drying',
      colourIntent: 'Deep navy body with a mineral green chest band', tones: 2,
      targetPrice: 24.5, orderBySize, sampleDate: '2027-01-15', deliveryDate: '2027-04-30',
      fibresToAvoid: ['wool'], recycledPct: 30, markets: ['eu', 'uk', 'us'],
    }),
  }, knex);

  await saveQuoteInputs(designer, style.id, {
    version: 0,
    inputs: quoteInputsSchema.parse({ speedPerMinute: 65, feedersPerCourse: 1, efficiency: 0.82, makingUp: { linking: 1.45 } }),
  }, knex);
}
