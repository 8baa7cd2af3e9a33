import { NextResponse } from 'next/server';
import { z } from 'zod';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { findStyle, shareStyle } from '@/lib/db/styles';
import { idParamSchema } from '@/lib/validations/style';

const shareSchema = z.object({ organisationId: z.string().uuid('Choose a mill or client') });

export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:share');
  const { id } = idParamSchema.parse(params);
  const { organisationId } = await parseBody(req, shareSchema);
  await shareStyle(user, id, organisationId);
  return NextResponse.json({ style: await findStyle(user, id) }, { status: 201 });
});
