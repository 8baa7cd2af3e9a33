import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { requireRelease } from '@/lib/db/releases';
import { releaseParamsSchema } from '@/lib/validations/mill';

/** A released revision as it was released: its frozen snapshot, reviews and comments. */
export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = releaseParamsSchema.parse(params);
  return NextResponse.json({ release: await requireRelease(user, id) });
});
