import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { addReference, listReferences } from '@/lib/db/briefs';
import { uploadLimits } from '@/lib/files/inspect';
import { inspectOrRefuse, readMultipart } from '@/lib/files/multipart';
import { objectStore } from '@/lib/storage/object-store';
import { referenceFieldsSchema } from '@/lib/validations/brief';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('brief:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json({ references: await listReferences(user, id) });
});

/** Adds a photo to the board (multipart: `file`, `caption`, `tag`); the type is read from the content. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const { file, fields } = await readMultipart(req, 'file', uploadLimits.photo);
  const meta = referenceFieldsSchema.parse({ caption: fields.caption ?? '', tag: fields.tag });
  const upload = inspectOrRefuse(file, ['photo'], 'file');
  const reference = await addReference(user, id, upload, file?.name ?? '', meta, objectStore());
  return NextResponse.json({ reference }, { status: 201 });
});
