import 'server-only';
import { forbidden, unauthorized } from '@/lib/api/errors';
import { findActiveUserById, type SessionUser } from '@/lib/db/users';
import { can, type Permission } from './roles';
import { getSession } from './session';

export type { SessionUser };

/** The signed-in user, or null. Reads the account fresh so deactivation and role changes apply at once. */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await getSession();
  if (!session.userId) return null;
  return findActiveUserById(session.userId);
}

/**
 * The one authorization helper: every route handler and server action calls it.
 * Throws 401 when signed out, 403 when the role lacks the permission.
 * Data scoping (studio, shares) is then applied by the data layer using the returned user.
 */
export async function authorize(permission?: Permission): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw unauthorized();
  if (permission && !can(user.role, permission)) throw forbidden();
  return user;
}
