import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';

export const GET = route(async () => {
  const user = await authorize();
  return NextResponse.json({ user });
});
