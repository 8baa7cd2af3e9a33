import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { forbidden } from '@/lib/api/errors';
import { authorize } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { listStyleFiles, uploadAttachment } from '@/lib/db/files';
import { uploadKinds, uploadLimits } from '@/lib/files/inspect';
import { inspectOrRefuse, readMultipart } from '@/lib/files/multipart';
import { objectStore } from '@/lib/storage/object-store';
import { styleIdParamSchema } from '@/lib/validations/mill';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = styleIdParamSchema.parse(params);
  return NextResponse.json({ files: await listStyleFiles(user, id) });
});

/** Uploads a photo, SVG or PDF to the style (multipart field `file`): the studio's editors and the mill. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:read');
  if (!can(user.role, 'style:edit') && !can(user.role, 'mill:upload')) throw forbidden();
  const { id } = styleIdParamSchema.parse(params);
  const { file } = await readMultipart(req, 'file', Math.max(...uploadKinds.map((k) => uploadLimits[k])));
  const upload = inspectOrRefuse(file, uploadKinds, 'file');
  const stored = await uploadAttachment(user, id, upload, file?.name ?? '', objectStore());
  return NextResponse.json({ file: stored, removed: upload.removed }, { status: 201 });
});
