import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { setStudioSeamlessFactor } from '@/lib/db/fit';
import { fitParamsSchema, seamlessFactorSchema } from '@/lib/validations/fit';

type Params = { id: string };

/** Sets the studio's cut-and-sew to seamless factor; carries the factor you saw (409 when it changed). */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = fitParamsSchema.parse(params);
  const input = await parseBody(req, seamlessFactorSchema);
  return NextResponse.json({ studioFactor: await setStudioSeamlessFactor(user, id, input) });
});
