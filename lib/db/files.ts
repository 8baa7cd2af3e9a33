import type { Knex } from 'knex';
import { createHash, randomUUID } from 'node:crypto';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { forbidden, notFound } from '@/lib/api/errors';
import { can, isOutsideRole } from '@/lib/auth/roles';
import type { InspectedUpload, UploadKind } from '@/lib/files/inspect';
import type { ObjectStore } from '@/lib/storage/object-store';

export type FilePurpose = 'attachment' | 'test-knit-photo' | 'mill-pack' | 'brief-reference' | 'sample-round-photo';

export interface StoredFile {
  id: string;
  styleId: string | null;
  releaseId: string | null;
  purpose: FilePurpose;
  kind: UploadKind;
  contentType: string;
  byteSize: number;
  widthPx: number | null;
  heightPx: number | null;
  sha256: string;
  originalName: string;
  uploadedBy: string | null;
  organisationName: string | null;
  createdAt: string;
  storageKey: string;
}

interface FileRow {
  id: string; studio_id: string; style_id: string | null; release_id: string | null; organisation_id: string | null; purpose: FilePurpose;
  kind: UploadKind; content_type: string; byte_size: number; width_px: number | null; height_px: number | null; sha256: string;
  storage_key: string; original_name: string; created_at: Date; uploaded_by_name?: string | null; organisation_name?: string | null;
}

function toFile(r: FileRow): StoredFile {
  return {
    id: r.id, styleId: r.style_id, releaseId: r.release_id, purpose: r.purpose, kind: r.kind, contentType: r.content_type, byteSize: r.byte_size,
    widthPx: r.width_px, heightPx: r.height_px, sha256: r.sha256, originalName: r.original_name, uploadedBy: r.uploaded_by_name ?? null,
    organisationName: r.organisation_name ?? null, createdAt: r.created_at.toISOString(), storageKey: r.storage_key,
  };
}

/** A display name kept for showing only: no path, no control characters, at most 200 characters. */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  return base.replace(/[\u0000-\u001f\u007f"<>]/g, '').trim().slice(0, 200);
}

export interface NewFile {
  studioId: string;
  styleId: string | null;
  releaseId?: string | null;
  organisationId: string | null;
  uploadedBy: string | null;
  purpose: FilePurpose;
  upload: Pick<InspectedUpload, 'kind' | 'contentType' | 'bytes' | 'widthPx' | 'heightPx'>;
  originalName: string;
}

/**
 * Writes the file's row in the caller's transaction, then the object. When the store fails, the
 * error rolls the transaction back (no row); the key is pushed to `written` so the caller can
 * delete the object if the transaction fails after the object was stored.
 */
export async function storeFile(trx: Knex.Transaction, store: ObjectStore, f: NewFile, written: string[]): Promise<StoredFile> {
  const key = `${f.studioId}/${f.styleId ?? 'studio'}/${f.purpose}/${randomUUID()}`;
  const [row] = (await trx('files')
    .insert({
      studio_id: f.studioId, style_id: f.styleId, release_id: f.releaseId ?? null, organisation_id: f.organisationId, uploaded_by: f.uploadedBy,
      purpose: f.purpose, kind: f.upload.kind, content_type: f.upload.contentType, byte_size: f.upload.bytes.byteLength,
      width_px: f.upload.widthPx, height_px: f.upload.heightPx, sha256: createHash('sha256').update(f.upload.bytes).digest('hex'),
      storage_key: key, original_name: safeFileName(f.originalName),
    })
    .returning('*')) as FileRow[];
  written.push(key);
  await store.put(key, f.upload.bytes, f.upload.contentType);
  return toFile(row!);
}

/**
 * Runs `fn` in a transaction with `storeFile` available; if anything fails after an object was
 * stored, the objects are deleted again, so a failed upload leaves neither a row nor an object.
 */
export async function withStoredFiles<T>(store: ObjectStore, fn: (trx: Knex.Transaction, written: string[]) => Promise<T>, q: Knex = db()): Promise<T> {
  const written: string[] = [];
  try {
    return await q.transaction((trx) => fn(trx, written));
  } catch (err) {
    for (const key of written) await store.delete(key).catch((e) => console.error('Could not remove an object after a failed write', key, e));
    throw err;
  }
}

const fileNotFound = () => notFound('File not found.');

/**
 * A file the user may download: the studio's staff any file of the studio; an outside account the
 * files its own organisation uploaded, the photos of the sample rounds of a style shared with it
 * (it reads those rounds), and (mills) the mill packs of releases sent to it.
 */
export async function findFileForUser(user: SessionUser, fileId: string, q: Db = db()): Promise<StoredFile> {
  const row = (await q('files as f')
    .leftJoin('users as u', 'u.id', 'f.uploaded_by')
    .leftJoin('organisations as o', 'o.id', 'f.organisation_id')
    .where({ 'f.id': fileId, 'f.studio_id': user.studioId })
    .first('f.*', 'u.name as uploaded_by_name', 'o.name as organisation_name')) as FileRow | undefined;
  if (!row) throw fileNotFound();
  if (row.style_id) {
    const style = await findStyle(user, row.style_id, q);
    if (!style) throw fileNotFound();
  }
  if (!isOutsideRole(user.role)) return toFile(row);
  if (row.organisation_id && row.organisation_id === user.organisationId) return toFile(row);
  // The style was found above, so it is shared with this account, which reads its rounds.
  if (row.purpose === 'sample-round-photo' && row.style_id) return toFile(row);
  if (row.purpose === 'mill-pack' && row.release_id && user.role === 'mill') {
    if (!can(user.role, 'mill:download')) throw forbidden();
    const sent = await q('release_mills').where({ release_id: row.release_id, organisation_id: user.organisationId ?? '' }).first();
    if (sent) return toFile(row);
  }
  throw fileNotFound();
}

/** Attachments and test-knit photos of a style the user may see, newest first. */
export async function listStyleFiles(user: SessionUser, styleId: string, q: Db = db()): Promise<StoredFile[]> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const qb = q('files as f')
    .leftJoin('users as u', 'u.id', 'f.uploaded_by')
    .leftJoin('organisations as o', 'o.id', 'f.organisation_id')
    .where({ 'f.studio_id': user.studioId, 'f.style_id': styleId })
    .whereIn('f.purpose', ['attachment', 'test-knit-photo'])
    .orderBy('f.created_at', 'desc')
    .limit(500)
    .select('f.*', 'u.name as uploaded_by_name', 'o.name as organisation_name');
  if (isOutsideRole(user.role)) qb.andWhere('f.organisation_id', user.organisationId ?? '');
  return ((await qb) as FileRow[]).map(toFile);
}

/** Stores an attachment (photo, SVG or PDF) on a style, with a history entry. */
export async function uploadAttachment(
  user: SessionUser, styleId: string, upload: InspectedUpload, originalName: string, store: ObjectStore, q: Knex = db(),
): Promise<StoredFile> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  return withStoredFiles(store, async (trx, written) => {
    const file = await storeFile(trx, store, {
      studioId: user.studioId, styleId, organisationId: isOutsideRole(user.role) ? user.organisationId : null, uploadedBy: user.id,
      purpose: 'attachment', upload, originalName,
    }, written);
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'file.upload',
      details: JSON.stringify({ fileId: file.id, kind: file.kind, name: file.originalName, bytes: file.byteSize, removed: upload.removed }),
    });
    return file;
  }, q);
}
