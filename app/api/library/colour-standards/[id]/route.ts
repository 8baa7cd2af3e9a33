import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { notFound } from '@/lib/api/errors';
import { archiveColourStandard, findColourStandard, updateColourStandard } from '@/lib/db/colour-standards';
import { colourStandardPatchSchema, standardParamsSchema } from '@/lib/validations/colour';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('library:read');
  const { id } = standardParamsSchema.parse(params);
  const standard = await findColourStandard(user, id);
  if (!standard) throw notFound('Colour standard not found.');
  return NextResponse.json({ standard });
});

/** Saves at the standard's version; a stale version gets 409 and nothing changes. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('colour:edit');
  const { id } = standardParamsSchema.parse(params);
  const patch = await parseBody(req, colourStandardPatchSchema);
  return NextResponse.json({ standard: await updateColourStandard(user, id, patch) });
});

/** Archives the standard (kept, hidden from the library; targets that use it still read it). */
export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('colour:edit');
  const { id } = standardParamsSchema.parse(params);
  await archiveColourStandard(user, id);
  return NextResponse.json({ ok: true });
});
