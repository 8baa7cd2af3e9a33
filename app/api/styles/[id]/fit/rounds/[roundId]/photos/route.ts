import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { addRoundPhoto } from '@/lib/db/fit';
import { uploadLimits } from '@/lib/files/inspect';
import { inspectOrRefuse, readMultipart } from '@/lib/files/multipart';
import { objectStore } from '@/lib/storage/object-store';
import { roundParamsSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string };

/** Attaches a photo of the sample to a round (multipart field `photo`; PNG, JPEG or WebP by content, up to 10 MB). */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const { file } = await readMultipart(req, 'photo', uploadLimits.photo);
  const upload = inspectOrRefuse(file, ['photo'], 'photo');
  const { photo, doc } = await addRoundPhoto(user, id, roundId, { upload, name: file?.name ?? '' }, objectStore());
  return NextResponse.json({ photo, fit: doc }, { status: 201 });
});
