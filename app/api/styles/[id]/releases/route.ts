import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { listReleases, releaseStyle } from '@/lib/db/releases';
import { releaseCreateSchema, styleIdParamSchema } from '@/lib/validations/mill';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = styleIdParamSchema.parse(params);
  return NextResponse.json({ releases: await listReleases(user, id) });
});

/** Releases the style's current revision to mills and e-mails them the link. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('style:release');
  const { id } = styleIdParamSchema.parse(params);
  const input = await parseBody(req, releaseCreateSchema);
  return NextResponse.json(await releaseStyle(user, id, input, { appUrl: env().APP_URL }), { status: 201 });
});
