import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadFitSheet } from '@/lib/db/fit';
import { fitParamsSchema } from '@/lib/validations/fit';

type Params = { id: string };

/** Needles, cylinders and the compression estimate per size, from the saved spec (the mill reads this). */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = fitParamsSchema.parse(params);
  return NextResponse.json({ sheet: await loadFitSheet(user, id) });
});
