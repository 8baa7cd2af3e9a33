import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { findFileForUser } from '@/lib/db/files';
import { objectStore } from '@/lib/storage/object-store';
import { fileParamsSchema } from '@/lib/validations/mill';

/** A private file, after checking the caller's studio, role and organisation. */
export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = fileParamsSchema.parse(params);
  const file = await findFileForUser(user, id);
  const bytes = await objectStore().get(file.storageKey);
  const name = (file.originalName || `${file.id}.${file.kind === 'photo' ? file.contentType.split('/')[1] : file.kind}`).replace(/[^\w.\- ]/g, '_');
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': file.contentType,
      'content-length': String(bytes.byteLength),
      'content-disposition': `${file.kind === 'pdf' ? 'attachment' : 'inline'}; filename="${name}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
      // Even a sanitised SVG opened on its own runs nothing and loads nothing.
      'content-security-policy': "default-src 'none'; img-src data:; style-src 'unsafe-inline'; sandbox",
    },
  });
});
