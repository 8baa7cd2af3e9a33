import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createColourway, listColourways } from '@/lib/db/colourways';
import { colourwayInputSchema } from '@/lib/validations/colour';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

/** The style's colourways with their dye plans, its yarns and the studio's colour settings. */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json(await listColourways(user, id));
});

export const POST = route<Params>(async (req, params) => {
  const user = await authorize('colour:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, colourwayInputSchema);
  return NextResponse.json({ colourway: await createColourway(user, id, input) }, { status: 201 });
});
