import { NextResponse } from 'next/server';

/** A bare route with a constant body: the yardstick for load figures. */
export function GET() {
  return NextResponse.json({ ok: true, service: 'needlemap' });
}
