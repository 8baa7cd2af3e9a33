import { NextResponse } from 'next/server';
import { route, parseBody, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createStyle, listStylesJson } from '@/lib/db/styles';
import { styleCreateSchema, styleListQuerySchema } from '@/lib/validations/style';

/** The styles the user may see; the list comes from the database as JSON text and is sent as it is. */
export const GET = route(async (req) => {
  const user = await authorize('style:read');
  const filter = parseQuery(req, styleListQuerySchema);
  return new Response(`{"styles":${await listStylesJson(user, filter)}}`, { headers: { 'content-type': 'application/json' } });
});

export const POST = route(async (req) => {
  const user = await authorize('style:create');
  const input = await parseBody(req, styleCreateSchema);
  return NextResponse.json({ style: await createStyle(user, input) }, { status: 201 });
});
