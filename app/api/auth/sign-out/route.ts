import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { getSession } from '@/lib/auth/session';

export const POST = route(async () => {
  const session = await getSession();
  session.destroy();
  return NextResponse.json({ ok: true });
});
