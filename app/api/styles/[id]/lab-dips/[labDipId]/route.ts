import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { decideLabDip, findLabDip } from '@/lib/db/lab-dips';
import { labDipDecisionSchema, labDipParamsSchema } from '@/lib/validations/colour';

type Params = { id: string; labDipId: string };

export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id, labDipId } = labDipParamsSchema.parse(params);
  return NextResponse.json({ labDip: await findLabDip(user, id, labDipId) });
});

/** The colour lead (or an admin) approves or rejects a submitted dip at its version; stale or decided gets 409. */
export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('labdip:decide');
  const { id, labDipId } = labDipParamsSchema.parse(params);
  const input = await parseBody(req, labDipDecisionSchema);
  return NextResponse.json({ labDip: await decideLabDip(user, id, labDipId, input) });
});
