import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { endSession } from '@/lib/auth/session';

export const POST = route(async () => {
  await endSession();
  return NextResponse.json({ ok: true });
});
