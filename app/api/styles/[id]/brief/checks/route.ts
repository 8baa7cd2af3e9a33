import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { briefChecks } from '@/lib/db/brief-checks';
import { idParamSchema } from '@/lib/validations/style';

/** Brief vs plan: the brief's targets checked against the knit plan as it stands. */
export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('brief:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json(await briefChecks(user, id));
});
