import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { decideProposal } from '@/lib/db/releases';
import { proposalDecisionSchema, releaseParamsSchema } from '@/lib/validations/mill';

/** The client approves the released revision or asks for changes. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('proposal:decide');
  const { id } = releaseParamsSchema.parse(params);
  const input = await parseBody(req, proposalDecisionSchema);
  return NextResponse.json(await decideProposal(user, id, input, { appUrl: env().APP_URL }));
});
