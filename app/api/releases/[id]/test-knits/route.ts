import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { listReleaseTestKnits, requestTestKnits } from '@/lib/db/test-knits';
import { releaseParamsSchema } from '@/lib/validations/mill';

type Params = { id: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = releaseParamsSchema.parse(params);
  return NextResponse.json({ testKnits: await listReleaseTestKnits(user, id) });
});

/** Requests a test knit of every texture of the release from every mill it went to. */
export const POST = route<Params>(async (_req, params) => {
  const user = await authorize('style:release');
  const { id } = releaseParamsSchema.parse(params);
  return NextResponse.json(await requestTestKnits(user, id, { appUrl: env().APP_URL }), { status: 201 });
});
