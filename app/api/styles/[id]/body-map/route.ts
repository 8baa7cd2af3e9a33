import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadBodyMap, saveBodyMap } from '@/lib/db/body-map';
import { bodyMapMaxBytes, bodyMapSaveSchema } from '@/lib/validations/body-map';
import { idParamSchema } from '@/lib/validations/style';
import { notFound } from '@/lib/api/errors';

type Params = { id: string };

/** The style's panels and zones, or generated panels when none are saved yet. */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:working-copy');
  const { id } = idParamSchema.parse(params);
  const map = await loadBodyMap(user, id);
  if (!map) throw notFound('Style not found.');
  return NextResponse.json(map);
});

/** Saves the whole map at the style's version; a stale version gets 409 and nothing changes. */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, bodyMapSaveSchema, { maxBytes: bodyMapMaxBytes });
  const { version } = await saveBodyMap(user, id, input);
  return NextResponse.json({ version });
});
