import 'server-only';
import { getIronSession, type SessionOptions } from 'iron-session';
import { cookies } from 'next/headers';
import { env } from '@/lib/env';

export interface SessionData {
  userId?: string;
}

export const SESSION_COOKIE = 'needlemap_session';

function options(): SessionOptions {
  const e = env();
  return {
    cookieName: SESSION_COOKIE,
    password: e.SESSION_SECRET,
    ttl: 60 * 60 * 12,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: e.cookieSecure, path: '/' },
  };
}

/** The caller's session (route handlers, server actions, server components). */
export async function getSession() {
  return getIronSession<SessionData>(await cookies(), options());
}
