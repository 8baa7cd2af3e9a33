import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { notFound } from '@/lib/api/errors';
import { archiveYarn, findYarn, updateYarn } from '@/lib/db/yarns';
import { archiveQuerySchema, idParamSchema, yarnPatchSchema } from '@/lib/validations/library';

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

/** Archives the yarn (kept, hidden from the library) when `?version=` is the version you saw; otherwise 409. */
export const DELETE = route<Params>(async (req, params) => {
  const user = await authorize('library:edit');
  const { id } = idParamSchema.parse(params);
  const { version } = parseQuery(req, archiveQuerySchema);
  await archiveYarn(user, id, version);
  return NextResponse.json({ ok: true });
});
