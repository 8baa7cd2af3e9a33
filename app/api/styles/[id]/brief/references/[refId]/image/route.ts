import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { referenceImage } from '@/lib/db/briefs';
import { objectStore } from '@/lib/storage/object-store';
import { referenceParamsSchema } from '@/lib/validations/brief';

/** A reference image, for those who may read the brief. */
export const GET = route<{ id: string; refId: string }>(async (_req, params) => {
  const user = await authorize('brief:read');
  const { id, refId } = referenceParamsSchema.parse(params);
  const image = await referenceImage(user, id, refId);
  const bytes = await objectStore().get(image.storageKey);
  return new Response(Buffer.from(bytes), {
    headers: {
      'content-type': image.contentType,
      'content-length': String(bytes.byteLength),
      'content-disposition': `inline; filename="${(image.name || 'reference').replace(/[^\w.\- ]/g, '_')}"`,
      'cache-control': 'private, max-age=300',
      'x-content-type-options': 'nosniff',
      'content-security-policy': "default-src 'none'; sandbox",
    },
  });
});
