import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { requestReview } from '@/lib/db/releases';
import { releaseParamsSchema, reviewRequestSchema } from '@/lib/validations/mill';

/** Asks a client to approve the released revision; e-mails them the link. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:release');
  const { id } = releaseParamsSchema.parse(params);
  const { clientId } = await parseBody(req, reviewRequestSchema);
  return NextResponse.json(await requestReview(user, id, clientId, { appUrl: env().APP_URL }), { status: 201 });
});
