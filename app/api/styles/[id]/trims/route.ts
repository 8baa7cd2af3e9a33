import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createTrim, listTrims } from '@/lib/db/trims';
import { idParamSchema, trimInputSchema } from '@/lib/validations/library';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:working-copy');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json({ trims: await listTrims(user, id) });
});

export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, trimInputSchema);
  return NextResponse.json({ trim: await createTrim(user, id, input) }, { status: 201 });
});
