import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { proposeCorrection } from '@/lib/db/fit';
import { correctionCreateSchema, roundParamsSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string };

/** Proposes a spec correction from a round (nothing changes until it is accepted); carries the style's version. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId } = roundParamsSchema.parse(params);
  const input = await parseBody(req, correctionCreateSchema);
  return NextResponse.json({ fit: await proposeCorrection(user, id, roundId, input) }, { status: 201 });
});
