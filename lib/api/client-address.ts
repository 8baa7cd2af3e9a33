import 'server-only';
import type { NextRequest } from 'next/server';
import { env } from '@/lib/env';

/**
 * The caller's address for rate limiting, or null when it is not known. Forwarded headers are read
 * only when the app is configured to sit behind a proxy (TRUST_PROXY=true), and then only the last
 * X-Forwarded-For entry: the one the proxy itself added. Earlier entries are whatever the caller sent.
 */
export function clientAddress(req: NextRequest): string | null {
  if (!env().trustProxy) return null;
  const last = req.headers.get('x-forwarded-for')?.split(',').at(-1)?.trim();
  return last ? last.slice(0, 64) : null;
}
