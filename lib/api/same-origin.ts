import 'server-only';
import type { NextRequest } from 'next/server';
import { env } from '@/lib/env';

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const firstValue = (v: string | null) => v?.split(',')[0]?.trim() || null;

/**
 * The origins the app answers as: the configured APP_URL, and the one the request was addressed to
 * (its Host header, or the proxy's forwarded host and scheme when TRUST_PROXY is set), so the demo
 * works under any name it is opened by. A page on another site cannot choose the Host its visitor's
 * browser sends, so this lets no other site in.
 */
function ownOrigins(req: NextRequest): string[] {
  const e = env();
  const own = [new URL(e.APP_URL).origin];
  const host = (e.trustProxy ? firstValue(req.headers.get('x-forwarded-host')) : null) ?? req.headers.get('host');
  const scheme = (e.trustProxy ? firstValue(req.headers.get('x-forwarded-proto')) : null) ?? req.nextUrl.protocol.replace(/:$/, '');
  if (host) own.push(`${scheme}://${host}`.toLowerCase());
  return own;
}

/**
 * True for a state-changing request (POST, PUT, PATCH, DELETE) sent from a page of another site:
 * its Origin header, or its Referer when there is no Origin, names an origin other than the app's
 * own. `Origin: null` (sandboxed frames, some redirects) and an unreadable Referer count as foreign.
 * A request with neither header comes from outside a browser (scripts, tests, the load figures) and
 * may go on: browsers send Origin with every cross-origin POST, PUT, PATCH and DELETE.
 */
export function isCrossSiteWrite(req: NextRequest): boolean {
  if (!stateChanging.has(req.method)) return false;
  const origin = req.headers.get('origin');
  let from: string;
  if (origin !== null) from = origin.toLowerCase();
  else {
    const referer = req.headers.get('referer');
    if (referer === null) return false;
    try {
      from = new URL(referer).origin.toLowerCase();
    } catch {
      return true;
    }
  }
  return !ownOrigins(req).includes(from);
}
