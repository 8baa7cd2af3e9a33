import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { addSampleComment } from '@/lib/db/fit';
import { roundParamsSchema, sampleCommentSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string };

/** Adds a comment to a round; carries the style's version. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const input = await parseBody(req, sampleCommentSchema);
  return NextResponse.json({ fit: await addSampleComment(user, id, roundId, input) }, { status: 201 });
});
