import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { packDataOf } from './pack-source';
import { conflict, forbidden, HttpError, notFound } from '@/lib/api/errors';
import { can, isOutsideRole } from '@/lib/auth/roles';
import { sendMail, type MailResult } from '@/lib/mail/mailer';
import { releaseMail, reviewDecisionMail, reviewMail } from '@/lib/mill/messages';
import type { PackApproval, PackData } from '@/lib/mill/pack-data';
import type { ProposalDecision, ReleaseCreate } from '@/lib/validations/mill';

export type ReviewStatus = 'pending' | 'approved' | 'changes-requested';

export interface ProposalReview {
  organisationId: string;
  organisationName: string;
  status: ReviewStatus;
  requestedAt: string;
  decidedBy: string | null;
  decidedAt: string | null;
  comment: string;
}

export interface ProposalComment {
  id: string;
  userName: string | null;
  organisationName: string | null;
  body: string;
  createdAt: string;
}

export interface ReleaseSummary {
  id: string;
  styleId: string;
  styleCode: string;
  styleName: string;
  revision: number;
  releasedAt: string;
  releasedBy: string | null;
  note: string;
  mills: { id: string; name: string }[];
  reviews: ProposalReview[];
}

export interface Release extends ReleaseSummary {
  snapshot: PackData;
  comments: ProposalComment[];
}

export const releaseNotFound = () => notFound('Release not found.');

interface ReleaseRow {
  id: string; studio_id: string; style_id: string; revision: number; note: string; released_at: Date; released_by_name: string | null;
  style_code: string; style_name: string;
}

/** Releases the user may see: staff of the studio all; a mill those sent to it; a client those it was asked to review. */
export function visibleReleases(user: SessionUser, q: Db = db()): Knex.QueryBuilder {
  const qb = q('releases as r')
    .join('styles as st', 'st.id', 'r.style_id')
    .where('r.studio_id', user.studioId)
    .whereNull('st.archived_at');
  if (user.role === 'mill') {
    qb.whereExists(q('release_mills as rm').whereRaw('rm.release_id = r.id').andWhere('rm.organisation_id', user.organisationId ?? ''));
  } else if (user.role === 'client') {
    qb.whereExists(q('proposal_reviews as pr').whereRaw('pr.release_id = r.id').andWhere('pr.organisation_id', user.organisationId ?? ''));
  }
  return qb;
}

function selectRelease(qb: Knex.QueryBuilder): Knex.QueryBuilder {
  return qb
    .leftJoin('users as u', 'u.id', 'r.released_by')
    .select('r.id', 'r.studio_id', 'r.style_id', 'r.revision', 'r.note', 'r.released_at', 'u.name as released_by_name', 'st.code as style_code', 'st.name as style_name');
}

async function summariesOf(user: SessionUser, rows: ReleaseRow[], q: Db): Promise<ReleaseSummary[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const millRows = (await q('release_mills as rm').join('organisations as o', 'o.id', 'rm.organisation_id').whereIn('rm.release_id', ids)
    .orderBy('o.name').select('rm.release_id', 'o.id', 'o.name')) as { release_id: string; id: string; name: string }[];
  const reviewRows = (await q('proposal_reviews as pr')
    .join('organisations as o', 'o.id', 'pr.organisation_id')
    .leftJoin('users as u', 'u.id', 'pr.decided_by')
    .whereIn('pr.release_id', ids)
    .orderBy('o.name')
    .select('pr.release_id', 'pr.organisation_id', 'o.name as organisation_name', 'pr.status', 'pr.requested_at', 'u.name as decided_by', 'pr.decided_at', 'pr.decision_comment')) as {
    release_id: string; organisation_id: string; organisation_name: string; status: ReviewStatus; requested_at: Date; decided_by: string | null; decided_at: Date | null; decision_comment: string;
  }[];
  const outside = isOutsideRole(user.role);
  return rows.map((r) => ({
    id: r.id,
    styleId: r.style_id,
    styleCode: r.style_code,
    styleName: r.style_name,
    revision: r.revision,
    releasedAt: r.released_at.toISOString(),
    releasedBy: r.released_by_name,
    note: r.note,
    // Outside accounts see only their own organisation among the recipients.
    mills: millRows.filter((m) => m.release_id === r.id && (!outside || m.id === user.organisationId)).map((m) => ({ id: m.id, name: m.name })),
    reviews: reviewRows
      .filter((v) => v.release_id === r.id && (!outside || v.organisation_id === user.organisationId))
      .map((v) => ({
        organisationId: v.organisation_id, organisationName: v.organisation_name, status: v.status, requestedAt: v.requested_at.toISOString(),
        decidedBy: v.decided_by, decidedAt: v.decided_at ? v.decided_at.toISOString() : null, comment: v.decision_comment,
      })),
  }));
}

/** The releases of a style the user may see, newest first. */
export async function listReleases(user: SessionUser, styleId: string, q: Db = db()): Promise<ReleaseSummary[]> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const rows = (await selectRelease(visibleReleases(user, q).andWhere('r.style_id', styleId)).orderBy('r.revision', 'desc')) as ReleaseRow[];
  return summariesOf(user, rows, q);
}

/** Every release the user may see across styles, newest first (the mill's own view). */
export async function listVisibleReleases(user: SessionUser, q: Db = db()): Promise<ReleaseSummary[]> {
  const rows = (await selectRelease(visibleReleases(user, q)).orderBy('r.released_at', 'desc').limit(200)) as ReleaseRow[];
  return summariesOf(user, rows, q);
}

/** One release with its frozen snapshot and comments; null when the user may not see it. */
export async function findRelease(user: SessionUser, releaseId: string, q: Db = db()): Promise<Release | null> {
  const row = (await selectRelease(visibleReleases(user, q).andWhere('r.id', releaseId)).first()) as ReleaseRow | undefined;
  if (!row) return null;
  const [summary] = await summariesOf(user, [row], q);
  const snap = (await q('releases').where({ id: releaseId }).first('snapshot')) as { snapshot: PackData };
  const comments = (await q('proposal_comments as c')
    .leftJoin('users as u', 'u.id', 'c.user_id')
    .leftJoin('organisations as o', 'o.id', 'c.organisation_id')
    .where('c.release_id', releaseId)
    .modify((qb) => {
      // A client sees the studio's comments and its own organisation's.
      if (isOutsideRole(user.role)) qb.andWhere((w) => w.whereNull('c.organisation_id').orWhere('c.organisation_id', user.organisationId ?? ''));
    })
    .orderBy('c.id')
    .select('c.id', 'u.name as user_name', 'o.name as organisation_name', 'c.body', 'c.created_at')) as {
    id: string; user_name: string | null; organisation_name: string | null; body: string; created_at: Date;
  }[];
  const snapshot = snap.snapshot;
  if (user.role === 'mill' && snapshot.release) {
    snapshot.release.mills = snapshot.release.mills.filter((m) => m.id === user.organisationId);
  }
  return {
    ...summary!,
    snapshot,
    comments: comments.map((c) => ({ id: String(c.id), userName: c.user_name, organisationName: c.organisation_name, body: c.body, createdAt: c.created_at.toISOString() })),
  };
}

export async function requireRelease(user: SessionUser, releaseId: string, q: Db = db()): Promise<Release> {
  const r = await findRelease(user, releaseId, q);
  if (!r) throw releaseNotFound();
  return r;
}

/** Contact addresses of organisations, with the active users who belong to them. */
async function contactsOf(organisationIds: readonly string[], q: Db): Promise<Map<string, { name: string; emails: string[] }>> {
  const orgs = (await q('organisations').whereIn('id', organisationIds).select('id', 'name', 'contact_emails')) as { id: string; name: string; contact_emails: string[] }[];
  return new Map(orgs.map((o) => [o.id, { name: o.name, emails: o.contact_emails }]));
}

export interface ReleaseResult {
  release: ReleaseSummary;
  mail: MailResult;
}

/**
 * Releases the style's current state to mills: freezes a snapshot of everything the pack is made
 * from, raises the revision when the current one was already released, sets the status to
 * released, shares the style with the mills, writes the history, then e-mails each mill's contacts
 * a link. `input.version` must be the style's version (else 409 and nothing changes).
 */
export async function releaseStyle(user: SessionUser, styleId: string, input: ReleaseCreate, opts: { appUrl: string }, q: Knex = db()): Promise<ReleaseResult> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  if (style.version !== input.version) {
    throw conflict('Someone saved this style after you opened it. Reload, check, and release again.', { currentVersion: style.version });
  }
  const mills = (await q('organisations').where({ studio_id: user.studioId, kind: 'mill' }).whereIn('id', input.millIds).select('id', 'name')) as { id: string; name: string }[];
  const errors: Record<string, string[]> = {};
  input.millIds.forEach((id, i) => {
    if (!mills.some((m) => m.id === id)) errors[`millIds.${i}`] = ['Not a mill of the studio'];
  });
  if (Object.keys(errors).length) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: errors });
  const { data } = await packDataOf(user, style, q);
  if (!data.textures.length) {
    throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { _: ['The style has no textures yet: there is nothing to knit.'] } });
  }

  const releaseId = await q.transaction(async (trx) => {
    const last = (await trx('releases').where({ style_id: styleId }).max('revision as max').first()) as { max: number | null } | undefined;
    const revision = last?.max && last.max >= style.revision ? last.max + 1 : style.revision;
    const bumped = await trx('styles')
      .where({ id: styleId, studio_id: user.studioId, version: input.version })
      .whereNull('archived_at')
      .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now(), revision, status: 'released' });
    if (bumped === 0) throw conflict('Someone saved this style while you released it. Reload and release again.', { currentVersion: style.version });
    const releasedAt = new Date();
    const snapshot: PackData = {
      ...data,
      style: { ...data.style, revision, status: 'released' },
      release: { id: '', revision, releasedAt: releasedAt.toISOString(), releasedBy: user.name, mills, note: input.note },
    };
    const [row] = (await trx('releases')
      .insert({ studio_id: user.studioId, style_id: styleId, revision, snapshot: JSON.stringify(snapshot), note: input.note, released_by: user.id, released_at: releasedAt })
      .returning('id')) as { id: string }[];
    const id = row!.id;
    snapshot.release!.id = id;
    await trx('releases').where({ id }).update({ snapshot: JSON.stringify(snapshot) });
    await trx('release_mills').insert(mills.map((m) => ({ release_id: id, organisation_id: m.id })));
    await trx('style_shares')
      .insert(mills.map((m) => ({ style_id: styleId, organisation_id: m.id, shared_by: user.id })))
      .onConflict(['style_id', 'organisation_id'])
      .ignore();
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'style.release',
      details: JSON.stringify({ revision, releaseId: id, mills: mills.map((m) => m.name), from: style.status }),
    });
    return id;
  });

  const release = (await findRelease(user, releaseId, q))!;
  const contacts = await contactsOf(mills.map((m) => m.id), q);
  const mail: MailResult = { sent: [], failed: [] };
  for (const m of mills) {
    const c = contacts.get(m.id);
    if (!c?.emails.length) continue;
    const msg = releaseMail({
      studio: user.studioName, code: style.code, name: style.name, revision: release.revision, mill: m.name,
      link: `${opts.appUrl}/releases/${releaseId}`, note: input.note, by: user.name,
    });
    const r = await sendMail({ to: c.emails, ...msg });
    mail.sent.push(...r.sent);
    mail.failed.push(...r.failed);
    if (r.skipped) mail.skipped = r.skipped;
  }
  if (mail.skipped) console.warn(`Release ${releaseId}: ${mail.skipped}`);
  if (mail.failed.length) {
    await q('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'mail.failed',
      details: JSON.stringify({ releaseId, failed: mail.failed.map((f) => f.to), skipped: mail.skipped ?? null }),
    });
  }
  return { release, mail };
}

/** Asks a client of the studio to approve a released revision (again, if it had decided), and e-mails its contacts. */
export async function requestReview(user: SessionUser, releaseId: string, clientId: string, opts: { appUrl: string }, q: Knex = db()): Promise<{ release: Release; mail: MailResult }> {
  const release = await requireRelease(user, releaseId, q);
  const client = (await q('organisations').where({ id: clientId, studio_id: user.studioId, kind: 'client' }).first()) as { id: string; name: string; contact_emails: string[] } | undefined;
  if (!client) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { clientId: ['Not a client of the studio'] } });
  await q.transaction(async (trx) => {
    await trx('proposal_reviews')
      .insert({ release_id: releaseId, organisation_id: clientId, requested_by: user.id })
      .onConflict(['release_id', 'organisation_id'])
      .merge({ status: 'pending', requested_by: user.id, requested_at: trx.fn.now(), decided_by: null, decided_at: null, decision_comment: '' });
    await trx('style_shares').insert({ style_id: release.styleId, organisation_id: clientId, shared_by: user.id }).onConflict(['style_id', 'organisation_id']).ignore();
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: release.styleId, user_id: user.id, action: 'proposal.request',
      details: JSON.stringify({ revision: release.revision, releaseId, client: client.name }),
    });
  });
  const msg = reviewMail({ studio: user.studioName, code: release.styleCode, name: release.styleName, revision: release.revision, link: `${opts.appUrl}/releases/${releaseId}`, by: user.name });
  const mail = await sendMail({ to: client.contact_emails, ...msg });
  return { release: (await findRelease(user, releaseId, q))!, mail };
}

/** A comment on a released revision: by the studio's staff, or by a client asked to review it. */
export async function addProposalComment(user: SessionUser, releaseId: string, body: string, q: Knex = db()): Promise<ProposalComment> {
  if (user.role === 'mill' || (!can(user.role, 'proposal:comment') && !can(user.role, 'style:edit'))) throw forbidden();
  const release = await requireRelease(user, releaseId, q);
  return q.transaction(async (trx) => {
    const [row] = (await trx('proposal_comments')
      .insert({ release_id: releaseId, user_id: user.id, organisation_id: isOutsideRole(user.role) ? user.organisationId : null, body })
      .returning(['id', 'created_at'])) as { id: string; created_at: Date }[];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: release.styleId, user_id: user.id, action: 'proposal.comment',
      details: JSON.stringify({ revision: release.revision, releaseId }),
    });
    return { id: String(row!.id), userName: user.name, organisationName: user.organisationName, body, createdAt: row!.created_at.toISOString() };
  });
}

/** The client's decision on a revision it was asked to review; e-mails the designer who asked. */
export async function decideProposal(user: SessionUser, releaseId: string, input: ProposalDecision, opts: { appUrl: string }, q: Knex = db()): Promise<{ release: Release; mail: MailResult }> {
  // The decision is the client's own: studio accounts comment but do not approve for the client.
  if (user.role !== 'client' || !user.organisationId) throw forbidden();
  const release = await requireRelease(user, releaseId, q);
  const requester = await q.transaction(async (trx) => {
    const review = (await trx('proposal_reviews').where({ release_id: releaseId, organisation_id: user.organisationId ?? '' }).forUpdate().first()) as
      | { requested_by: string | null }
      | undefined;
    if (!review) throw releaseNotFound();
    await trx('proposal_reviews')
      .where({ release_id: releaseId, organisation_id: user.organisationId ?? '' })
      .update({ status: input.decision, decided_by: user.id, decided_at: trx.fn.now(), decision_comment: input.comment });
    if (input.comment) {
      await trx('proposal_comments').insert({ release_id: releaseId, user_id: user.id, organisation_id: user.organisationId, body: input.comment });
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: release.styleId, user_id: user.id, action: 'proposal.decide',
      details: JSON.stringify({ revision: release.revision, releaseId, decision: input.decision, client: user.organisationName }),
    });
    return review.requested_by;
  });
  const to = requester ? ((await q('users').where({ id: requester, active: true }).pluck('email')) as string[]) : [];
  const msg = reviewDecisionMail({
    code: release.styleCode, revision: release.revision, client: user.organisationName ?? user.name, decision: input.decision, comment: input.comment,
    link: `${opts.appUrl}/releases/${releaseId}`,
  });
  const mail = to.length ? await sendMail({ to, ...msg }) : { sent: [], failed: [] };
  return { release: (await findRelease(user, releaseId, q))!, mail };
}

/** Decisions recorded on a release, for the pack's cover: client reviews and test knits. */
export async function releaseApprovals(releaseId: string, q: Db = db()): Promise<PackApproval[]> {
  const reviews = (await q('proposal_reviews as pr')
    .join('organisations as o', 'o.id', 'pr.organisation_id')
    .leftJoin('users as u', 'u.id', 'pr.decided_by')
    .join('releases as r', 'r.id', 'pr.release_id')
    .where('pr.release_id', releaseId)
    .whereNot('pr.status', 'pending')
    .select('o.name', 'pr.status', 'u.name as by', 'pr.decided_at', 'pr.decision_comment', 'r.revision')) as {
    name: string; status: string; by: string | null; decided_at: Date; decision_comment: string; revision: number;
  }[];
  const knits = (await q('test_knits as k')
    .leftJoin('users as u', 'u.id', 'k.decided_by')
    .join('organisations as o', 'o.id', 'k.organisation_id')
    .where('k.release_id', releaseId)
    .whereIn('k.status', ['approved', 'change-requested'])
    .orderBy('k.texture_name')
    .select('k.texture_name', 'o.name as mill', 'k.status', 'u.name as by', 'k.decided_at', 'k.decision_comment')) as {
    texture_name: string; mill: string; status: string; by: string | null; decided_at: Date; decision_comment: string;
  }[];
  return [
    ...reviews.map((r) => ({ what: `Client review (${r.name}), revision ${r.revision}`, decision: r.status, by: r.by ?? r.name, at: r.decided_at.toISOString(), comment: r.decision_comment })),
    ...knits.map((k) => ({ what: `Test knit: ${k.texture_name} (${k.mill})`, decision: k.status, by: k.by ?? '—', at: k.decided_at.toISOString(), comment: k.decision_comment })),
  ];
}
