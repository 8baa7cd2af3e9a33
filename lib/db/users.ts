import { db, type Db } from './knex';
import { deleteUserSessions } from './sessions';
import type { Role } from '@/lib/auth/roles';

export interface SessionUser {
  id: string;
  studioId: string;
  studioName: string;
  organisationId: string | null;
  organisationName: string | null;
  email: string;
  name: string;
  role: Role;
}

export interface Member extends SessionUser {
  active: boolean;
  createdAt: string;
}

interface UserRow {
  id: string;
  studio_id: string;
  studio_name: string;
  organisation_id: string | null;
  organisation_name: string | null;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  created_at: Date;
  password_hash?: string;
}

function baseQuery(q: Db) {
  return q('users as u')
    .join('studios as s', 's.id', 'u.studio_id')
    .leftJoin('organisations as o', 'o.id', 'u.organisation_id')
    .select(
      'u.id', 'u.studio_id', 's.name as studio_name', 'u.organisation_id', 'o.name as organisation_name',
      'u.email', 'u.name', 'u.role', 'u.active', 'u.created_at',
    );
}

function toMember(r: UserRow): Member {
  return {
    id: r.id,
    studioId: r.studio_id,
    studioName: r.studio_name,
    organisationId: r.organisation_id,
    organisationName: r.organisation_name,
    email: r.email,
    name: r.name,
    role: r.role,
    active: r.active,
    createdAt: r.created_at.toISOString(),
  };
}

export async function findActiveUserById(id: string, q: Db = db()): Promise<SessionUser | null> {
  const row = (await baseQuery(q).where('u.id', id).andWhere('u.active', true).first()) as UserRow | undefined;
  if (!row) return null;
  const { active: _a, createdAt: _c, ...user } = toMember(row);
  return user;
}

/**
 * The account signed in with a session, in one query: the session row must exist and not have run
 * out, and the account must be active. Read on every request, so sign-out, a password change or a
 * deactivation (each deletes rows, or the account's `active`) applies at once.
 */
export async function findUserBySession(sessionId: string, q: Db = db()): Promise<SessionUser | null> {
  const row = (await baseQuery(q)
    .join('sessions as se', 'se.user_id', 'u.id')
    .where('se.id', sessionId)
    .andWhere('se.expires_at', '>', q.fn.now())
    .andWhere('u.active', true)
    .first()) as UserRow | undefined;
  if (!row) return null;
  const { active: _a, createdAt: _c, ...user } = toMember(row);
  return user;
}

/** For the password change only: the account's current hash. */
export async function findPasswordHash(id: string, q: Db = db()): Promise<string | null> {
  const row = (await q('users').where({ id }).first('password_hash')) as { password_hash: string } | undefined;
  return row?.password_hash ?? null;
}

/**
 * Sets a new password hash and ends every session of the account except `keepSessionId` (the one
 * that changed it), in one transaction. Returns how many sessions were ended.
 */
export async function changePassword(id: string, passwordHash: string, keepSessionId: string, q: Db = db()): Promise<number> {
  return q.transaction(async (trx) => {
    await trx('users').where({ id }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
    return deleteUserSessions(id, { keepId: keepSessionId }, trx);
  });
}

/** For sign-in only: the account with its hash. */
export async function findUserForSignIn(email: string, q: Db = db()) {
  const row = (await baseQuery(q).select('u.password_hash').where('u.email', email).first()) as UserRow | undefined;
  return row ? { ...toMember(row), passwordHash: row.password_hash as string } : null;
}

export async function listMembers(studioId: string, q: Db = db()): Promise<Member[]> {
  const rows = (await baseQuery(q).where('u.studio_id', studioId).orderBy([{ column: 'u.active', order: 'desc' }, 'u.name'])) as UserRow[];
  return rows.map(toMember);
}

export async function findMember(studioId: string, id: string, q: Db = db()): Promise<Member | null> {
  const row = (await baseQuery(q).where('u.studio_id', studioId).andWhere('u.id', id).first()) as UserRow | undefined;
  return row ? toMember(row) : null;
}

export async function insertMember(
  studioId: string,
  m: { email: string; name: string; role: Role; passwordHash: string; organisationId: string | null },
  q: Db = db(),
): Promise<string> {
  const [row] = await q('users')
    .insert({
      studio_id: studioId,
      email: m.email,
      name: m.name,
      role: m.role,
      password_hash: m.passwordHash,
      organisation_id: m.organisationId,
    })
    .returning('id');
  return (row as { id: string }).id;
}

export async function updateMember(
  studioId: string,
  id: string,
  patch: { role?: Role; active?: boolean; name?: string; organisationId?: string | null },
  q: Db = db(),
): Promise<number> {
  const values: Record<string, unknown> = { updated_at: q.fn.now() };
  if (patch.role !== undefined) values.role = patch.role;
  if (patch.active !== undefined) values.active = patch.active;
  if (patch.name !== undefined) values.name = patch.name;
  if (patch.organisationId !== undefined) values.organisation_id = patch.organisationId;
  return q.transaction(async (trx) => {
    const updated = await trx('users').where({ studio_id: studioId, id }).update(values);
    // A deactivated account is signed out everywhere; reactivating it does not bring old sessions back.
    if (updated && patch.active === false) await deleteUserSessions(id, {}, trx);
    return updated;
  });
}

export async function countActiveAdmins(studioId: string, q: Db = db()): Promise<number> {
  const row = await q('users').where({ studio_id: studioId, role: 'admin', active: true }).count<{ count: string }[]>('* as count').first();
  return Number(row?.count ?? 0);
}
