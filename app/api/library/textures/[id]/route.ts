import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { notFound } from '@/lib/api/errors';
import { archiveTexture, findTexture, updateTexture } from '@/lib/db/textures';
import { archiveQuerySchema, idParamSchema, texturePatchSchema } from '@/lib/validations/library';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('library:read');
  const { id } = idParamSchema.parse(params);
  const texture = await findTexture(user, id);
  if (!texture) throw notFound('Texture not found.');
  return NextResponse.json({ texture });
});

export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('library:edit');
  const { id } = idParamSchema.parse(params);
  const patch = await parseBody(req, texturePatchSchema);
  return NextResponse.json({ texture: await updateTexture(user, id, patch) });
});

/** Archives the texture (kept, hidden from the library) when `?version=` is the version you saw; otherwise 409. */
export const DELETE = route<Params>(async (req, params) => {
  const user = await authorize('library:edit');
  const { id } = idParamSchema.parse(params);
  const { version } = parseQuery(req, archiveQuerySchema);
  await archiveTexture(user, id, version);
  return NextResponse.json({ ok: true });
});
