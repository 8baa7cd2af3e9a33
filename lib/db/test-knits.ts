import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { studioSettings } from './studio-settings';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { requireRelease } from './releases';
import { storeFile, withStoredFiles } from './files';
import { conflict, forbidden, notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
import type { InspectedUpload } from '@/lib/files/inspect';
import { sendMail, type MailResult } from '@/lib/mail/mailer';
import { defaultTestKnitThresholdPct, testKnitDeviation, type TestKnitDeviation } from '@/lib/mill/deviation';
import { testKnitDecisionMail, testKnitRequestMail, testKnitSubmittedMail } from '@/lib/mill/messages';
import { textureFacts } from '@/lib/mill/pack-data';
import type { ObjectStore } from '@/lib/storage/object-store';
import type { TestKnitDecision, TestKnitSubmission } from '@/lib/validations/mill';

export type TestKnitStatus = 'requested' | 'knitted' | 'approved' | 'change-requested';

export interface TestKnit {
  id: string;
  styleId: string;
  releaseId: string;
  revision: number;
  millId: string;
  millName: string;
  textureId: string;
  textureName: string;
  planned: { walesPerCm: number; coursesPerCm: number; gsm: number | null };
  measured: { walesPerCm: number; coursesPerCm: number; gsm: number | null } | null;
  deviation: TestKnitDeviation | null;
  flagged: boolean;
  status: TestKnitStatus;
  millNote: string;
  photoFileId: string | null;
  requestedAt: string;
  knittedAt: string | null;
  knittedBy: string | null;
  decidedAt: string | null;
  decidedBy: string | null;
  decisionComment: string;
  version: number;
}

interface KnitRow {
  id: string; studio_id: string; style_id: string; release_id: string; revision: number; organisation_id: string; mill_name: string;
  texture_id: string; texture_name: string; planned_wales_per_cm: number; planned_courses_per_cm: number; planned_gsm: number | null;
  status: TestKnitStatus; measured_wales_per_cm: number | null; measured_courses_per_cm: number | null; measured_gsm: number | null;
  mill_note: string; photo_file_id: string | null; flagged: boolean; requested_at: Date; knitted_at: Date | null; knitted_by_name: string | null;
  decided_at: Date | null; decided_by_name: string | null; decision_comment: string; version: number; requested_by: string | null;
}

/** The studio's test-knit threshold, % (studios.settings.testKnitThresholdPct), else the common-practice 5 %. */
export async function testKnitThreshold(studioId: string, q: Db = db()): Promise<number> {
  const v = (await studioSettings(studioId, q)).testKnitThresholdPct;
  return typeof v === 'number' && v >= 0 && v <= 100 ? v : defaultTestKnitThresholdPct;
}

function toKnit(r: KnitRow, thresholdPct: number): TestKnit {
  const planned = { walesPerCm: r.planned_wales_per_cm, coursesPerCm: r.planned_courses_per_cm, gsm: r.planned_gsm };
  const measured =
    r.measured_wales_per_cm !== null && r.measured_courses_per_cm !== null
      ? { walesPerCm: r.measured_wales_per_cm, coursesPerCm: r.measured_courses_per_cm, gsm: r.measured_gsm }
      : null;
  return {
    id: r.id, styleId: r.style_id, releaseId: r.release_id, revision: r.revision, millId: r.organisation_id, millName: r.mill_name,
    textureId: r.texture_id, textureName: r.texture_name, planned, measured,
    deviation: measured ? testKnitDeviation(planned, measured, thresholdPct) : null,
    flagged: r.flagged, status: r.status, millNote: r.mill_note, photoFileId: r.photo_file_id,
    requestedAt: r.requested_at.toISOString(), knittedAt: r.knitted_at?.toISOString() ?? null, knittedBy: r.knitted_by_name,
    decidedAt: r.decided_at?.toISOString() ?? null, decidedBy: r.decided_by_name, decisionComment: r.decision_comment, version: r.version,
  };
}

function knitQuery(user: SessionUser, q: Db): Knex.QueryBuilder {
  const qb = q('test_knits as k')
    .join('releases as r', 'r.id', 'k.release_id')
    .join('organisations as o', 'o.id', 'k.organisation_id')
    .join('styles as st', 'st.id', 'k.style_id')
    .leftJoin('users as ku', 'ku.id', 'k.knitted_by')
    .leftJoin('users as du', 'du.id', 'k.decided_by')
    .where('k.studio_id', user.studioId)
    .whereNull('st.archived_at')
    .select('k.*', 'r.revision', 'o.name as mill_name', 'ku.name as knitted_by_name', 'du.name as decided_by_name');
  // A mill sees its own test knits only; clients none.
  if (user.role === 'mill') qb.andWhere('k.organisation_id', user.organisationId ?? '');
  else if (user.role === 'client') qb.whereRaw('false');
  return qb;
}

/** Test knits of a style the user may see, by revision (newest first) and texture. */
export async function listTestKnits(user: SessionUser, styleId: string, q: Db = db()): Promise<TestKnit[]> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const threshold = await testKnitThreshold(user.studioId, q);
  const rows = (await knitQuery(user, q).andWhere('k.style_id', styleId).orderBy([{ column: 'r.revision', order: 'desc' }, { column: 'o.name' }, { column: 'k.texture_name' }])) as KnitRow[];
  return rows.map((r) => toKnit(r, threshold));
}

/** The test knits of one release. */
export async function listReleaseTestKnits(user: SessionUser, releaseId: string, q: Db = db()): Promise<TestKnit[]> {
  await requireRelease(user, releaseId, q);
  const threshold = await testKnitThreshold(user.studioId, q);
  const rows = (await knitQuery(user, q).andWhere('k.release_id', releaseId).orderBy([{ column: 'o.name' }, { column: 'k.texture_name' }])) as KnitRow[];
  return rows.map((r) => toKnit(r, threshold));
}

export async function findTestKnit(user: SessionUser, id: string, q: Db = db()): Promise<TestKnit | null> {
  const row = (await knitQuery(user, q).andWhere('k.id', id).first()) as KnitRow | undefined;
  return row ? toKnit(row, await testKnitThreshold(user.studioId, q)) : null;
}

const knitNotFound = () => notFound('Test knit not found.');

/**
 * Requests a test knit of every texture of the release from every mill it was sent to (one click
 * for all); those already requested stay as they are. E-mails each mill the list.
 */
export async function requestTestKnits(user: SessionUser, releaseId: string, opts: { appUrl: string }, q: Knex = db()): Promise<{ testKnits: TestKnit[]; created: number; mail: MailResult }> {
  const release = await requireRelease(user, releaseId, q);
  const facts = textureFacts(release.snapshot);
  const created = await q.transaction(async (trx) => {
    const rows = release.mills.flatMap((m) =>
      facts.map((f) => ({
        studio_id: user.studioId, style_id: release.styleId, release_id: releaseId, organisation_id: m.id,
        texture_id: f.texture.id, texture_name: f.texture.name,
        planned_wales_per_cm: f.texture.density.walesPerCm, planned_courses_per_cm: f.texture.density.coursesPerCm,
        planned_gsm: f.gsm === null ? null : Math.round(f.gsm * 10) / 10, requested_by: user.id,
      })),
    );
    if (!rows.length) return 0;
    const inserted = (await trx('test_knits').insert(rows).onConflict(['release_id', 'organisation_id', 'texture_id']).ignore().returning('id')) as { id: string }[];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: release.styleId, user_id: user.id, action: 'test-knit.request',
      details: JSON.stringify({ revision: release.revision, releaseId, requested: inserted.length, textures: facts.length, mills: release.mills.map((m) => m.name) }),
    });
    return inserted.length;
  });
  const mail: MailResult = { sent: [], failed: [] };
  if (created > 0) {
    const orgs = (await q('organisations').whereIn('id', release.mills.map((m) => m.id)).select('id', 'name', 'contact_emails')) as { id: string; name: string; contact_emails: string[] }[];
    for (const o of orgs) {
      const msg = testKnitRequestMail({ code: release.styleCode, revision: release.revision, mill: o.name, textures: facts.map((f) => f.texture.name), link: `${opts.appUrl}/releases/${releaseId}` });
      const r = await sendMail({ to: o.contact_emails, ...msg });
      mail.sent.push(...r.sent);
      mail.failed.push(...r.failed);
    }
  }
  return { testKnits: await listReleaseTestKnits(user, releaseId, q), created, mail };
}

/**
 * The mill's test knit: the photo and the measured figures, compared with the plan and flagged past
 * the studio's threshold. The photo row, the object and the figures are written together or not at
 * all. E-mails the designer who requested it.
 */
export async function submitTestKnit(
  user: SessionUser, id: string, input: TestKnitSubmission, photo: { upload: InspectedUpload; name: string }, store: ObjectStore,
  opts: { appUrl: string }, q: Knex = db(),
): Promise<{ testKnit: TestKnit; mail: MailResult }> {
  if (user.role !== 'mill') throw forbidden();
  const current = await findTestKnit(user, id, q);
  if (!current) throw knitNotFound();
  if (current.status === 'approved') throw conflict('This test knit is approved already: nothing more to send.');
  const threshold = await testKnitThreshold(user.studioId, q);
  const measured = { walesPerCm: input.walesPerCm, coursesPerCm: input.coursesPerCm, gsm: input.gsm };
  const deviation = testKnitDeviation(current.planned, measured, threshold);
  const requester = await withStoredFiles(store, async (trx, written) => {
    const locked = (await trx('test_knits').where({ id, organisation_id: user.organisationId ?? '' }).forUpdate().first()) as KnitRow | undefined;
    if (!locked) throw knitNotFound();
    if (locked.status === 'approved') throw conflict('This test knit is approved already: nothing more to send.');
    const file = await storeFile(trx, store, {
      studioId: user.studioId, styleId: current.styleId, releaseId: current.releaseId, organisationId: user.organisationId, uploadedBy: user.id,
      purpose: 'test-knit-photo', upload: photo.upload, originalName: photo.name,
    }, written);
    await trx('test_knits').where({ id }).update({
      status: 'knitted', measured_wales_per_cm: measured.walesPerCm, measured_courses_per_cm: measured.coursesPerCm, measured_gsm: measured.gsm,
      mill_note: input.note, photo_file_id: file.id, flagged: deviation.flagged, knitted_by: user.id, knitted_at: trx.fn.now(),
      decided_by: null, decided_at: null, decision_comment: '', version: trx.raw('version + 1'),
    });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: current.styleId, user_id: user.id, action: 'test-knit.submit',
      details: JSON.stringify({ testKnitId: id, texture: current.textureName, flagged: deviation.flagged, deviation: deviation.figures.map((f) => ({ figure: f.figure, percent: Math.round(f.percent * 10) / 10 })) }),
    });
    return locked.requested_by;
  }, q);
  const testKnit = (await findTestKnit(user, id, q))!;
  const to = requester ? ((await q('users').where({ id: requester, active: true }).pluck('email')) as string[]) : [];
  const summary = deviation.figures.map((f) => `${f.label}: planned ${f.planned}, measured ${f.measured} (${f.percent >= 0 ? '+' : ''}${f.percent.toFixed(1)} %${f.flagged ? ', past the threshold' : ''})`).join('\n');
  const mail = to.length
    ? await sendMail({ to, ...testKnitSubmittedMail({ code: (await findStyle(user, current.styleId, q))?.code ?? '', texture: current.textureName, mill: current.millName, flagged: deviation.flagged, summary, link: `${opts.appUrl}/styles/${current.styleId}/test-knits` }) })
    : { sent: [], failed: [] };
  return { testKnit, mail };
}

/** The designer's decision on a knitted test piece; e-mails the mill's contacts. */
export async function decideTestKnit(user: SessionUser, id: string, input: TestKnitDecision, opts: { appUrl: string }, q: Knex = db()): Promise<{ testKnit: TestKnit; mail: MailResult }> {
  if (isOutsideRole(user.role)) throw forbidden();
  const current = await findTestKnit(user, id, q);
  if (!current) throw knitNotFound();
  if (current.status !== 'knitted') {
    throw conflict(current.status === 'requested' || current.status === 'change-requested' ? 'The mill has not sent this test knit yet.' : 'This test knit is decided already.');
  }
  await q.transaction(async (trx) => {
    const n = await trx('test_knits').where({ id, version: input.version, status: 'knitted' }).update({
      status: input.decision, decided_by: user.id, decided_at: trx.fn.now(), decision_comment: input.comment, version: trx.raw('version + 1'),
    });
    if (n === 0) throw conflict('The mill sent a newer test knit after you opened it. Reload to see it.', { currentVersion: current.version });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: current.styleId, user_id: user.id, action: 'test-knit.decide',
      details: JSON.stringify({ testKnitId: id, texture: current.textureName, mill: current.millName, decision: input.decision }),
    });
  });
  const org = (await q('organisations').where({ id: current.millId }).first('contact_emails')) as { contact_emails: string[] } | undefined;
  const code = (await findStyle(user, current.styleId, q))?.code ?? '';
  const mail = org?.contact_emails.length
    ? await sendMail({ to: org.contact_emails, ...testKnitDecisionMail({ code, texture: current.textureName, decision: input.decision, comment: input.comment, link: `${opts.appUrl}/releases/${current.releaseId}` }) })
    : { sent: [], failed: [] };
  return { testKnit: (await findTestKnit(user, id, q))!, mail };
}
