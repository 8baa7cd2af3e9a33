import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { archiveColourway, findColourway, updateColourway } from '@/lib/db/colourways';
import { colourwayParamsSchema, colourwayPatchSchema } from '@/lib/validations/colour';

type Params = { id: string; colourwayId: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id, colourwayId } = colourwayParamsSchema.parse(params);
  return NextResponse.json({ colourway: await findColourway(user, id, colourwayId) });
});

/** Saves name, notes or the whole target list at the colourway's version; stale gets 409. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('colour:edit');
  const { id, colourwayId } = colourwayParamsSchema.parse(params);
  const patch = await parseBody(req, colourwayPatchSchema);
  return NextResponse.json({ colourway: await updateColourway(user, id, colourwayId, patch) });
});

/** Archives the colourway (kept with its lab dips, hidden). */
export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('colour:edit');
  const { id, colourwayId } = colourwayParamsSchema.parse(params);
  await archiveColourway(user, id, colourwayId);
  return NextResponse.json({ ok: true });
});
