import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createTexture, listTextures } from '@/lib/db/textures';
import { textureInputSchema } from '@/lib/validations/library';

export const GET = route(async () => {
  const user = await authorize('library:read');
  return NextResponse.json({ textures: await listTextures(user) });
});

export const POST = route(async (req) => {
  const user = await authorize('library:edit');
  const input = await parseBody(req, textureInputSchema);
  return NextResponse.json({ texture: await createTexture(user, input) }, { status: 201 });
});
