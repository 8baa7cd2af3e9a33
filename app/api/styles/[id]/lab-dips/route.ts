import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { listLabDips, submitLabDip } from '@/lib/db/lab-dips';
import { labDipInputSchema, labDipQuerySchema } from '@/lib/validations/colour';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

/** Lab dips of the style: staff see all, a mill its own, a client reviewer the approved ones. */
export const GET = route<Params>(async (req, params) => {
  const user = await authorize('style:read');
  const { id } = idParamSchema.parse(params);
  const filter = parseQuery(req, labDipQuerySchema);
  return NextResponse.json({ labDips: await listLabDips(user, id, filter) });
});

/** A mill (or an admin) submits a lab dip: one reading or CSV readings, and a comment. */
export const POST = route<Params>(async (req, params) => {
  const user = await authorize('mill:upload');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, labDipInputSchema);
  return NextResponse.json({ labDip: await submitLabDip(user, id, input) }, { status: 201 });
});
