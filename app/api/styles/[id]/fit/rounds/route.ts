import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createSampleRound } from '@/lib/db/fit';
import { fitParamsSchema, sampleRoundCreateSchema } from '@/lib/validations/fit';

type Params = { id: string };

/** Records a sample round with its measurements; carries the style's version. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = fitParamsSchema.parse(params);
  const input = await parseBody(req, sampleRoundCreateSchema);
  const { round, doc } = await createSampleRound(user, id, input);
  return NextResponse.json({ round, fit: doc }, { status: 201 });
});
