import 'server-only';
import { cache } from 'react';
import { forbidden, unauthorized } from '@/lib/api/errors';
import { findUserBySession, type SessionUser } from '@/lib/db/users';
import { can, type Permission } from './roles';
import { cookieSessionId } from './session';

export type { SessionUser };

/**
 * The caller's session and account, or null when signed out. The cookie names a session row; the
 * row and the account are read fresh in one query, so sign-out, a password change, deactivation and
 * role changes apply at once. Within one server render (layout and page of one view) the read is
 * shared through React's per-request cache; route handlers read it once each.
 */
export const currentSession = cache(async (): Promise<{ user: SessionUser; sessionId: string } | null> => {
  const sessionId = await cookieSessionId();
  if (!sessionId) return null;
  const user = await findUserBySession(sessionId);
  return user ? { user, sessionId } : null;
});

/** The signed-in user, or null. */
export async function currentUser(): Promise<SessionUser | null> {
  return (await currentSession())?.user ?? null;
}

/**
 * The one authorization helper: every route handler and server action calls it (or
 * `authorizeSession` when it needs the session id too).
 * Throws 401 when signed out, 403 when the role lacks the permission.
 * Data scoping (studio, shares) is then applied by the data layer using the returned user.
 */
export async function authorize(permission?: Permission): Promise<SessionUser> {
  return (await authorizeSession(permission)).user;
}

/** As `authorize`, with the id of the caller's session (to end every other one). */
export async function authorizeSession(permission?: Permission): Promise<{ user: SessionUser; sessionId: string }> {
  const session = await currentSession();
  if (!session) throw unauthorized();
  if (permission && !can(session.user.role, permission)) throw forbidden();
  return session;
}
