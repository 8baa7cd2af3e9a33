import 'server-only';
import type { NextRequest } from 'next/server';
import { env } from '@/lib/env';

/**
 * The caller's address for rate limiting. Forwarded headers are trusted only when the app is
 * configured to sit behind a proxy (TRUST_PROXY=true); otherwise anyone could pick an address.
 */
export function clientAddress(req: NextRequest): string {
  if (env().trustProxy) {
    const fwd = req.headers.get('x-forwarded-for');
    if (fwd) return fwd.split(',')[0]!.trim().slice(0, 64);
  }
  return 'direct';
}
