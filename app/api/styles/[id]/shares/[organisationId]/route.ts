import { NextResponse } from 'next/server';
import { z } from 'zod';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { unshareStyle } from '@/lib/db/styles';

const paramsSchema = z.object({ id: z.string().uuid(), organisationId: z.string().uuid() });

export const DELETE = route<{ id: string; organisationId: string }>(async (_req, params) => {
  const user = await authorize('style:share');
  const { id, organisationId } = paramsSchema.parse(params);
  await unshareStyle(user, id, organisationId);
  return NextResponse.json({ ok: true });
});
