import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createYarn, listYarns } from '@/lib/db/yarns';
import { yarnInputSchema } from '@/lib/validations/library';

export const GET = route(async () => {
  const user = await authorize('library:read');
  return NextResponse.json({ yarns: await listYarns(user) });
});

export const POST = route(async (req) => {
  const user = await authorize('library:edit');
  const input = await parseBody(req, yarnInputSchema);
  return NextResponse.json({ yarn: await createYarn(user, input) }, { status: 201 });
});
