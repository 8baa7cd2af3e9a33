import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createStyle, listStyles } from '@/lib/db/styles';
import { styleCreateSchema, styleListQuerySchema } from '@/lib/validations/style';

export const GET = route(async (req) => {
  const user = await authorize('style:read');
  const filter = parseQuery(req, styleListQuerySchema);
  return NextResponse.json({ styles: await listStyles(user, filter) });
});

export const POST = route(async (req) => {
  const user = await authorize('style:create');
  const input = await parseBody(req, styleCreateSchema);
  return NextResponse.json({ style: await createStyle(user, input) }, { status: 201 });
});
