import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { listTestKnits } from '@/lib/db/test-knits';
import { styleIdParamSchema } from '@/lib/validations/mill';

/** The style's test knits the user may see (a mill: its own). */
export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = styleIdParamSchema.parse(params);
  return NextResponse.json({ testKnits: await listTestKnits(user, id) });
});
