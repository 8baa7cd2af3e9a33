import type { Knex } from 'knex';
import type { SessionUser } from '../../lib/db/users';
import { releaseStyle, requestReview } from '../../lib/db/releases';
import { requestTestKnits } from '../../lib/db/test-knits';

/**
 * Demo data: the compression long sleeve (HF27-101) released to the demo mill as it stands after
 * the body maps (hence after 06_body_maps), the demo client asked to approve it, and a test knit of
 * every texture requested, so the mill's view has something to knit. Every note is invented.
 * E-mails are not sent while seeding (no SMTP host is set then).
 */
export async function seed(knex: Knex): Promise<void> {
  // Only the mill round's own tables (releases cascade to their mills, reviews, comments, test knits and packs).
  await knex.raw('truncate table mill_pack_jobs, test_knits, proposal_comments, proposal_reviews, release_mills, releases restart identity cascade');
  await knex('files').whereIn('purpose', ['mill-pack', 'test-knit-photo']).del();

  const studio = await knex('studios').where({ name: 'Hollowfell Knit Lab' }).first();
  const designer = await knex('users').where({ email: 'designer@hollowfell.example' }).first();
  const style = await knex('styles').where({ studio_id: studio?.id, code: 'HF27-101' }).first();
  const mill = await knex('organisations').where({ studio_id: studio?.id, name: 'Quellmoor Knitworks' }).first();
  const client = await knex('organisations').where({ studio_id: studio?.id, name: 'Varrow Sport' }).first();
  if (!studio || !designer || !style || !mill || !client) throw new Error('Run the earlier seeds first: the demo studio, HF27-101 or its mill is missing.');
  const user: SessionUser = {
    id: designer.id, studioId: studio.id, studioName: studio.name, organisationId: null, organisationName: null,
    email: designer.email, name: designer.name, role: 'designer',
  };
  const env = { ...process.env };
  delete process.env.SMTP_HOST;
  try {
    const appUrl = process.env.APP_URL ?? 'http://127.0.0.1:3000';
    const { release } = await releaseStyle(user, style.id, { version: style.version, millIds: [mill.id], note: 'Please knit the ventilation mesh first: the back vent depends on it.' }, { appUrl }, knex);
    await requestReview(user, release.id, client.id, { appUrl }, knex);
    await requestTestKnits(user, release.id, { appUrl }, knex);
  } finally {
    if (env.SMTP_HOST) process.env.SMTP_HOST = env.SMTP_HOST;
  }
}
