import 'server-only';
import type { NextRequest } from 'next/server';
import { env } from '@/lib/env';
import { forwardedClientAddress } from './forwarded-address';

/** The caller's address for rate limiting, or null when it is not known: see `forwardedClientAddress`. */
export function clientAddress(req: NextRequest): string | null {
  return forwardedClientAddress(env().trustProxy, req.headers.get('x-forwarded-for'));
}
