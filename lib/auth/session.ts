import 'server-only';
import { sealData, unsealData } from 'iron-session';
import { cookies } from 'next/headers';
import { env } from '@/lib/env';
import { deleteSession, insertSession } from '@/lib/db/sessions';
import { LruMap } from './lru';

export const SESSION_COOKIE = 'needlemap_session';
/** How long a session lasts from sign-in, in seconds. */
export const sessionTtlSeconds = 60 * 60 * 12;
/** How many unsealed cookies each server process keeps (a few hundred bytes each). */
export const unsealedCookieCapacity = 5000;

/** What the sealed cookie holds: the id of a row in `sessions`, and when the session ends. */
export interface SealedSession {
  sessionId: string;
  expiresAtMs: number;
}

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

// On globalThis so every route bundle of the process shares one cache.
const globalForSessions = globalThis as unknown as { needlemapUnsealedCookies?: LruMap<string, SealedSession> };
const unsealed = () => (globalForSessions.needlemapUnsealedCookies ??= new LruMap(unsealedCookieCapacity));

function cookieOptions() {
  return { httpOnly: true, sameSite: 'lax', secure: env().cookieSecure, path: '/' } as const;
}

/**
 * Reads a session cookie: its session id and end, or null when it is tampered with, sealed with
 * another secret, of an older shape or past its end. Unsealing derives keys from the secret, which
 * costs more than the rest of a small request, so good results are kept per cookie string in a
 * bounded cache. Only the unsealing is cached: whether the session row still exists is asked of
 * the database on every request (lib/db/users.ts `findUserBySession`), so ending a session is immediate.
 */
export async function unsealSession(seal: string): Promise<SealedSession | null> {
  const cache = unsealed();
  let session = cache.get(seal);
  if (!session) {
    const data = await unsealData<Partial<SealedSession>>(seal, { password: env().SESSION_SECRET, ttl: sessionTtlSeconds });
    if (typeof data.sessionId !== 'string' || !uuid.test(data.sessionId) || typeof data.expiresAtMs !== 'number') return null;
    session = { sessionId: data.sessionId, expiresAtMs: data.expiresAtMs };
    cache.set(seal, session);
  }
  if (session.expiresAtMs <= Date.now()) {
    cache.delete(seal);
    return null;
  }
  return session;
}

/** The id of the caller's session as its cookie says (route handlers, server components); not yet checked against the database. */
export async function cookieSessionId(): Promise<string | null> {
  const seal = (await cookies()).get(SESSION_COOKIE)?.value;
  if (!seal) return null;
  return (await unsealSession(seal))?.sessionId ?? null;
}

/** Signs an account in: a new session row, and its id sealed into the cookie (route handlers only). */
export async function startSession(userId: string, userAgent: string | null): Promise<void> {
  const expiresAtMs = Date.now() + sessionTtlSeconds * 1000;
  const sessionId = await insertSession({ userId, expiresAt: new Date(expiresAtMs), userAgent });
  const seal = await sealData({ sessionId, expiresAtMs } satisfies SealedSession, { password: env().SESSION_SECRET, ttl: sessionTtlSeconds });
  // The cookie goes a minute before the seal does, so a browser never sends a seal that has just run out.
  (await cookies()).set(SESSION_COOKIE, seal, { ...cookieOptions(), maxAge: sessionTtlSeconds - 60 });
}

/** Signs the caller out: deletes the session row and clears the cookie (route handlers only). */
export async function endSession(): Promise<void> {
  const jar = await cookies();
  const seal = jar.get(SESSION_COOKIE)?.value;
  if (seal) {
    const session = await unsealSession(seal);
    if (session) await deleteSession(session.sessionId);
    unsealed().delete(seal);
  }
  jar.set(SESSION_COOKIE, '', { ...cookieOptions(), maxAge: 0 });
}
