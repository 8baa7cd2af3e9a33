import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { findStyle, findStyleStamped } from './styles';
import { packDataOf } from './pack-source';
import { requireRelease, visibleReleases } from './releases';
import { DataCache } from './data-cache';
import { notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
import { exportFile, type ExportFile } from '@/lib/mill/export-file';
import type { PackData } from '@/lib/mill/pack-data';
import type { ExportKind, ExportQuery } from '@/lib/validations/mill';

/** What a style's exports are made from for one user, and the key of that data for the export cache. */
export interface ExportSource {
  /** Names the data: a release (frozen) or the working copy at its data stamp. */
  key: string;
  /** Reads the data; `complete` is false when a part could not be read just now and was left out. */
  read: () => Promise<{ data: PackData; complete: boolean }>;
}

/**
 * Where the exports of a style come from for this user: a release's frozen snapshot when
 * `releaseId` is given (or, for a mill or client, the latest release they may see); the working
 * copy for the studio's staff otherwise. Outside accounts never get the working copy. Checks that
 * the user may see the style and the release; the data itself is read by `read`.
 */
export async function exportSource(user: SessionUser, styleId: string, releaseId: string | null | undefined, q: Knex = db()): Promise<ExportSource> {
  if (!releaseId && !isOutsideRole(user.role)) {
    const found = await findStyleStamped(user, styleId, q);
    if (!found) throw notFound('Style not found.');
    return { key: `working|${found.style.id}|${found.stamp}`, read: () => packDataOf(user, found.style, q) };
  }
  if (!(await findStyle(user, styleId, q))) throw notFound('Style not found.');
  let id = releaseId;
  if (id) {
    const row = (await visibleReleases(user, q).andWhere('r.id', id).first('r.style_id')) as { style_id: string } | undefined;
    if (!row || row.style_id !== styleId) throw notFound('Release not found.');
  } else {
    const latest = (await visibleReleases(user, q).andWhere('r.style_id', styleId).orderBy('r.released_at', 'desc').first('r.id')) as { id: string } | undefined;
    if (!latest) throw notFound('Nothing of this style was released to you yet.');
    id = latest.id;
  }
  const releaseIdToRead = id;
  // A mill reads itself alone among the recipients (findRelease), so its copy is its own.
  const reader = user.role === 'mill' ? `mill:${user.organisationId}` : 'all';
  return {
    key: `release|${releaseIdToRead}|${reader}`,
    read: async () => ({ data: (await requireRelease(user, releaseIdToRead, q)).snapshot, complete: true }),
  };
}

/** The exports built once per data and kept: the swatch sheet (a PDF of some 0.5 MB that takes a second or two to draw). */
const keptKinds: ReadonlySet<ExportKind> = new Set(['swatch-sheet.pdf']);

// Per process, keyed by the data's key (lib/db/data-cache.ts); bounded by bytes.
const keptFiles = new DataCache<{ file: ExportFile; complete: boolean }>({
  maxEntries: 128,
  maxBytes: 48 * 1024 * 1024,
  sizeOf: (v) => v.file.body.byteLength,
  keepIf: (v) => v.complete,
});

/** Everything of the query that the kept kinds depend on. */
const exportKey = (kind: ExportKind, query: ExportQuery) => `${kind}|${query.paper}`;

/**
 * One export of a style for this user (see `exportSource`). The swatch sheet is drawn once per
 * data and paper size and then served from memory until the data changes; the other exports are
 * made per request.
 */
export async function styleExport(user: SessionUser, styleId: string, kind: ExportKind, query: ExportQuery, q: Knex = db()): Promise<ExportFile> {
  const source = await exportSource(user, styleId, query.release, q);
  const make = async () => {
    const { data, complete } = await source.read();
    return { file: exportFile(data, kind, query), complete };
  };
  // Read inside a transaction, the data may yet be rolled back: not to be shared.
  if (!keptKinds.has(kind) || (q as Knex.Transaction).isTransaction) return (await make()).file;
  return (await keptFiles.get(`${source.key}|${exportKey(kind, query)}`, make)).file;
}
