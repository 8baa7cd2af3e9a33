import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { deleteSampleRound, updateSampleRound } from '@/lib/db/fit';
import { objectStore } from '@/lib/storage/object-store';
import { roundParamsSchema, sampleRoundDeleteSchema, sampleRoundPatchSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string };

/** Changes a round's details or measurements; carries the style's version. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const input = await parseBody(req, sampleRoundPatchSchema);
  return NextResponse.json({ fit: await updateSampleRound(user, id, roundId, input) });
});

/**
 * Deletes a round with its measurements, comments, corrections and photos; the spec changes of its
 * accepted corrections stay. Carries the style's version as `?version=` (409 when stale).
 */
export const DELETE = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const { version } = parseQuery(req, sampleRoundDeleteSchema);
  return NextResponse.json({ fit: await deleteSampleRound(user, id, roundId, version, objectStore()) });
});
