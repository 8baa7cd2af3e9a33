import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { decideTestKnit } from '@/lib/db/test-knits';
import { testKnitDecisionSchema, testKnitParamsSchema } from '@/lib/validations/mill';

/** The designer approves the test knit or asks the mill for a change. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:release');
  const { id } = testKnitParamsSchema.parse(params);
  const input = await parseBody(req, testKnitDecisionSchema);
  return NextResponse.json(await decideTestKnit(user, id, input, { appUrl: env().APP_URL }));
});
