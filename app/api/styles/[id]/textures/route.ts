import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { listStyleTextures, setStyleTextures } from '@/lib/db/textures';
import { idParamSchema, styleTexturesPutSchema } from '@/lib/validations/library';

type Params = { id: string };

/** The textures the style uses, with their yarns: for everyone who can see the style. */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:working-copy');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json(await listStyleTextures(user, id));
});

/** Replaces the style's texture list; carries the style's version. */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, styleTexturesPutSchema);
  return NextResponse.json(await setStyleTextures(user, id, input));
});
