import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { archiveStyle, findStyle, updateStyle } from '@/lib/db/styles';
import { idParamSchema, stylePatchSchema } from '@/lib/validations/style';
import { notFound } from '@/lib/api/errors';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = idParamSchema.parse(params);
  const style = await findStyle(user, id);
  if (!style) throw notFound('Style not found.');
  return NextResponse.json({ style });
});

export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const patch = await parseBody(req, stylePatchSchema);
  return NextResponse.json({ style: await updateStyle(user, id, patch) });
});

/** Archives the style (it is kept, hidden from lists). */
export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('style:archive');
  const { id } = idParamSchema.parse(params);
  await archiveStyle(user, id);
  return NextResponse.json({ ok: true });
});
