import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { updateSampleRound } from '@/lib/db/fit';
import { roundParamsSchema, sampleRoundPatchSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string };

/** Changes a round's details or measurements; carries the style's version. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const input = await parseBody(req, sampleRoundPatchSchema);
  return NextResponse.json({ fit: await updateSampleRound(user, id, roundId, input) });
});
