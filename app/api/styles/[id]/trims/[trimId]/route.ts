import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { deleteTrim, updateTrim } from '@/lib/db/trims';
import { trimDeleteQuerySchema, trimParamsSchema, trimPatchSchema } from '@/lib/validations/library';

type Params = { id: string; trimId: string };

export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, trimId } = trimParamsSchema.parse(params);
  const patch = await parseBody(req, trimPatchSchema);
  return NextResponse.json({ trim: await updateTrim(user, id, trimId, patch) });
});

/** Removes the trim; `?version=` makes it conditional on the version you saw. */
export const DELETE = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, trimId } = trimParamsSchema.parse(params);
  const { version } = parseQuery(req, trimDeleteQuerySchema);
  await deleteTrim(user, id, trimId, version);
  return NextResponse.json({ ok: true });
});
