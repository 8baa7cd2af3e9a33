import { db, type Db } from './knex';

/** Starts a session row for an account; its id goes into the sealed cookie. Clears rows past their end. */
export async function insertSession(
  s: { userId: string; expiresAt: Date; userAgent: string | null },
  q: Db = db(),
): Promise<string> {
  await q('sessions').where('expires_at', '<', q.fn.now()).del();
  const [row] = await q('sessions')
    .insert({ user_id: s.userId, expires_at: s.expiresAt, user_agent: s.userAgent?.slice(0, 300) ?? null })
    .returning('id');
  return (row as { id: string }).id;
}

/** Ends one session (sign-out). */
export async function deleteSession(id: string, q: Db = db()): Promise<number> {
  return q('sessions').where({ id }).del();
}

/** Ends every session of an account, or every one but `keepId` (a password change keeps the caller signed in). */
export async function deleteUserSessions(userId: string, opts: { keepId?: string } = {}, q: Db = db()): Promise<number> {
  const query = q('sessions').where({ user_id: userId });
  if (opts.keepId) query.whereNot({ id: opts.keepId });
  return query.del();
}
