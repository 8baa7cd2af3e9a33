import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { findActiveUserById, type SessionUser } from './users';
import { findStyle } from './styles';
import { exportSource } from './exports';
import { listVisibleReleases, releaseApprovals, requireRelease } from './releases';
import { storeFile, withStoredFiles } from './files';
import { notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
import { millPackPdf } from '@/lib/mill/mill-pack-pdf';
import type { PackApproval, PackData, PaperSize } from '@/lib/mill/pack-data';
import type { ObjectStore } from '@/lib/storage/object-store';
import type { MillPackStart } from '@/lib/validations/mill';

export type JobStatus = 'queued' | 'running' | 'done' | 'failed';

export interface MillPackJob {
  id: string;
  styleId: string;
  releaseId: string | null;
  paper: PaperSize;
  status: JobStatus;
  progress: number;
  step: string;
  fileId: string | null;
  pages: number | null;
  error: string;
  createdAt: string;
  finishedAt: string | null;
}

interface JobRow {
  id: string; studio_id: string; style_id: string; release_id: string | null; requested_by: string | null; paper: PaperSize; status: JobStatus;
  progress: number; step: string; file_id: string | null; pages: number | null; error: string; created_at: Date; finished_at: Date | null;
}

function toJob(r: JobRow): MillPackJob {
  return {
    id: r.id, styleId: r.style_id, releaseId: r.release_id, paper: r.paper, status: r.status, progress: r.progress, step: r.step,
    fileId: r.file_id, pages: r.pages, error: r.error, createdAt: r.created_at.toISOString(), finishedAt: r.finished_at?.toISOString() ?? null,
  };
}

/**
 * What the exports of a style are made from, for this user: a release's frozen snapshot when
 * `releaseId` is given (or, for a mill, the latest release sent to it); the working copy for the
 * studio's staff otherwise. Outside accounts never get the working copy.
 */
export async function loadExportData(user: SessionUser, styleId: string, releaseId: string | null | undefined, q: Knex = db()): Promise<PackData> {
  return (await (await exportSource(user, styleId, releaseId, q)).read()).data;
}

async function accessibleJob(user: SessionUser, id: string, q: Db): Promise<JobRow> {
  const row = (await q('mill_pack_jobs').where({ id, studio_id: user.studioId }).first()) as JobRow | undefined;
  const notThere = () => notFound('That mill pack is not there.');
  if (!row) throw notThere();
  if (!(await findStyle(user, row.style_id, q))) throw notThere();
  if (isOutsideRole(user.role)) {
    if (!row.release_id) throw notThere();
    await requireRelease(user, row.release_id, q).catch(() => {
      throw notThere();
    });
  }
  return row;
}

export async function findMillPackJob(user: SessionUser, id: string, q: Db = db()): Promise<MillPackJob> {
  return toJob(await accessibleJob(user, id, q));
}

/** Queues a mill pack for a style (working copy: staff only) or one of its releases. */
export async function createMillPackJob(user: SessionUser, styleId: string, input: MillPackStart, q: Knex = db()): Promise<MillPackJob> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  let releaseId = input.releaseId;
  if (releaseId) {
    const r = await requireRelease(user, releaseId, q);
    if (r.styleId !== styleId) throw notFound('Release not found.');
  } else if (isOutsideRole(user.role)) {
    const latest = (await listVisibleReleases(user, q)).find((r) => r.styleId === styleId);
    if (!latest) throw notFound('Nothing of this style was released to you yet.');
    releaseId = latest.id;
  }
  const [row] = (await q('mill_pack_jobs')
    .insert({ studio_id: user.studioId, style_id: styleId, release_id: releaseId, requested_by: user.id, paper: input.paper, step: 'Waiting to start' })
    .returning('*')) as JobRow[];
  return toJob(row!);
}

/**
 * Builds a queued pack: reads the data, renders the PDF with progress written to the job, stores
 * the file and marks the job done — or failed, with the reason, leaving no file behind.
 */
export async function runMillPackJob(jobId: string, store: ObjectStore, q: Knex = db()): Promise<void> {
  const job = (await q('mill_pack_jobs').where({ id: jobId }).first()) as JobRow | undefined;
  if (!job || job.status !== 'queued') return;
  const claimed = await q('mill_pack_jobs').where({ id: jobId, status: 'queued' }).update({ status: 'running', step: 'Reading the style', progress: 1 });
  if (claimed === 0) return;
  let lastWrite = 0;
  const progress = async (percent: number, step: string) => {
    const now = Date.now();
    if (now - lastWrite < 150 && percent < 99) return;
    lastWrite = now;
    await q('mill_pack_jobs').where({ id: jobId }).update({ progress: Math.max(1, Math.min(99, Math.round(percent))), step });
  };
  try {
    const user = job.requested_by ? await findActiveUserById(job.requested_by, q) : null;
    if (!user) throw new Error('The account that asked for this pack is no longer active.');
    const data = await loadExportData(user, job.style_id, job.release_id, q);
    const approvals: PackApproval[] = job.release_id ? await releaseApprovals(job.release_id, q) : [];
    const pdf = await millPackPdf(data, { paper: job.paper, approvals }, progress);
    await progress(99, 'Storing the file');
    await withStoredFiles(store, async (trx, written) => {
      const rev = data.release?.revision ?? data.style.revision;
      const file = await storeFile(trx, store, {
        studioId: job.studio_id, styleId: job.style_id, releaseId: job.release_id, organisationId: null, uploadedBy: user.id, purpose: 'mill-pack',
        upload: { kind: 'pdf', contentType: 'application/pdf', bytes: pdf.bytes, widthPx: null, heightPx: null },
        originalName: `${data.style.code}-rev${rev}${job.release_id ? '' : '-working'}-mill-pack-${job.paper}.pdf`,
      }, written);
      await trx('mill_pack_jobs').where({ id: jobId }).update({ status: 'done', progress: 100, step: 'Ready', file_id: file.id, pages: pdf.pages, finished_at: trx.fn.now() });
      await trx('audit_log').insert({
        studio_id: job.studio_id, style_id: job.style_id, user_id: user.id, action: 'mill-pack.generate',
        details: JSON.stringify({ revision: rev, releaseId: job.release_id, pages: pdf.pages, paper: job.paper }),
      });
    }, q);
  } catch (err) {
    console.error('Mill pack failed', jobId, err);
    const message = err instanceof Error && err.message ? err.message : 'The pack could not be built.';
    await q('mill_pack_jobs').where({ id: jobId }).update({ status: 'failed', step: 'Failed', error: message.slice(0, 500), finished_at: q.fn.now() }).catch(() => {});
  }
}
