import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { addProposalComment } from '@/lib/db/releases';
import { commentSchema, releaseParamsSchema } from '@/lib/validations/mill';

/** A comment on a released revision: the client asked to review it, or the studio's editors. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:read');
  const { id } = releaseParamsSchema.parse(params);
  const { body } = await parseBody(req, commentSchema);
  return NextResponse.json({ comment: await addProposalComment(user, id, body) }, { status: 201 });
});
