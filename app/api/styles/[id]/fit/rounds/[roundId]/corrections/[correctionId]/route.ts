import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { decideCorrection } from '@/lib/db/fit';
import { correctionDecisionSchema, correctionParamsSchema } from '@/lib/validations/fit';

type Params = { id: string; roundId: string; correctionId: string };

/** Accepts (updating the spec, with a history entry) or rejects a proposed correction; carries the style's version. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, roundId, correctionId } = correctionParamsSchema.parse(params);
  const input = await parseBody(req, correctionDecisionSchema);
  return NextResponse.json({ fit: await decideCorrection(user, id, roundId, correctionId, input) });
});
