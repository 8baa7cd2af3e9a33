import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { reorderReferences } from '@/lib/db/briefs';
import { referenceOrderSchema } from '@/lib/validations/brief';
import { idParamSchema } from '@/lib/validations/style';

/** Puts the board in a new order: every reference id, once. */
export const PUT = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const { ids } = await parseBody(req, referenceOrderSchema);
  return NextResponse.json({ references: await reorderReferences(user, id, ids) });
});
