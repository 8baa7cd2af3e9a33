import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createColourStandard, listColourStandards } from '@/lib/db/colour-standards';
import { colourStandardInputSchema } from '@/lib/validations/colour';

export const GET = route(async () => {
  const user = await authorize('library:read');
  return NextResponse.json({ standards: await listColourStandards(user) });
});

export const POST = route(async (req) => {
  const user = await authorize('colour:edit');
  const input = await parseBody(req, colourStandardInputSchema);
  return NextResponse.json({ standard: await createColourStandard(user, input) }, { status: 201 });
});
