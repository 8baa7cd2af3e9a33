import { db, type Db } from './knex';

/** Limits on failed sign-ins, per window. Common practice, no published source. */
export const signInLimits = { windowMinutes: 15, perAccount: 5, perAddress: 30 } as const;

function windowStart(now: Date): Date {
  const ms = signInLimits.windowMinutes * 60_000;
  return new Date(Math.floor(now.getTime() / ms) * ms);
}

/** Seconds until the caller may try again, or 0 when under both limits. Counted in PostgreSQL. */
export async function signInBlockedFor(email: string, address: string, now = new Date(), q: Db = db()): Promise<number> {
  const start = windowStart(now);
  const rows = (await q('sign_in_attempts')
    .whereIn('key', [`email:${email}`, `ip:${address}`])
    .andWhere('window_start', start)
    .select('key', 'failures')) as { key: string; failures: number }[];
  const blocked = rows.some((r) =>
    r.key.startsWith('email:') ? r.failures >= signInLimits.perAccount : r.failures >= signInLimits.perAddress,
  );
  if (!blocked) return 0;
  return Math.max(1, Math.ceil((start.getTime() + signInLimits.windowMinutes * 60_000 - now.getTime()) / 1000));
}

export async function recordSignInFailure(email: string, address: string, now = new Date(), q: Db = db()): Promise<void> {
  const start = windowStart(now);
  for (const key of [`email:${email}`, `ip:${address}`]) {
    await q.raw(
      `insert into sign_in_attempts (key, window_start, failures) values (?, ?, 1)
       on conflict (key, window_start) do update set failures = sign_in_attempts.failures + 1`,
      [key, start],
    );
  }
  // Old windows are of no use; keep the table small.
  await q('sign_in_attempts').where('window_start', '<', new Date(start.getTime() - 24 * 3600_000)).del();
}

export async function clearSignInFailures(email: string, q: Db = db()): Promise<void> {
  await q('sign_in_attempts').where('key', `email:${email}`).del();
}
