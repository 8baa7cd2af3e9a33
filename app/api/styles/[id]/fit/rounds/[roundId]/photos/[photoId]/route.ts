import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { removeRoundPhoto } from '@/lib/db/fit';
import { objectStore } from '@/lib/storage/object-store';
import { roundPhotoParamsSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string; photoId: string };

/** Removes a photo from a round, and its stored image. */
export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId, photoId } = roundPhotoParamsSchema.parse(params);
  return NextResponse.json({ fit: await removeRoundPhoto(user, id, roundId, photoId, objectStore()) });
});
