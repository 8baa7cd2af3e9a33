import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { notFound } from '@/lib/api/errors';
import { archiveYarn, findYarn, updateYarn } from '@/lib/db/yarns';
import { idParamSchema, yarnPatchSchema } from '@/lib/validations/library';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('library:read');
  const { id } = idParamSchema.parse(params);
  const yarn = await findYarn(user, id);
  if (!yarn) throw notFound('Yarn not found.');
  return NextResponse.json({ yarn });
});

export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('library:edit');
  const { id } = idParamSchema.parse(params);
  const patch = await parseBody(req, yarnPatchSchema);
  return NextResponse.json({ yarn: await updateYarn(user, id, patch) });
});

/** Archives the yarn (kept, hidden from the library). */
export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('library:edit');
  const { id } = idParamSchema.parse(params);
  await archiveYarn(user, id);
  return NextResponse.json({ ok: true });
});
