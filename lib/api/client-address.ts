import type { NextRequest } from 'next/server';

/** The caller's address for rate limiting: the first forwarded hop when behind a proxy. */
export function clientAddress(req: NextRequest): string {
  const fwd = req.headers.get('x-forwarded-for');
  if (fwd) return fwd.split(',')[0]!.trim().slice(0, 64);
  return (req.headers.get('x-real-ip') ?? 'local').slice(0, 64);
}
