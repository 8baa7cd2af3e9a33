import { db, type Db } from './knex';

/** Limits on failed sign-ins, per window. Common practice, no published source. */
export const signInLimits = { windowMinutes: 15, perAccount: 5, perAddress: 30 } as const;

function windowStart(now: Date): Date {
  const ms = signInLimits.windowMinutes * 60_000;
  return new Date(Math.floor(now.getTime() / ms) * ms);
}

function keysFor(email: string, address: string | null): string[] {
  return address === null ? [`email:${email}`] : [`email:${email}`, `ip:${address}`];
}

/** One password check, counted as a failure before the password is compared. */
export type SignInAttempt = { email: string; address: string | null; windowStart: Date; waitSeconds: number };

/**
 * Counts a password check as a failure up front (per account, and per address when the address is
 * known), in one statement, and then compares the counts with the limits: parallel attempts each get
 * their own count, so a burst cannot pass the limit. `waitSeconds` is 0 when the check may go ahead,
 * otherwise the seconds until the window ends. A check that turns out right is taken back with
 * `signInSucceeded`.
 */
export async function reserveSignInAttempt(email: string, address: string | null, now = new Date(), q: Db = db()): Promise<SignInAttempt> {
  const start = windowStart(now);
  const keys = keysFor(email, address);
  const { rows } = (await q.raw(
    `insert into sign_in_attempts (key, window_start, failures) values ${keys.map(() => '(?, ?, 1)').join(', ')}
     on conflict (key, window_start) do update set failures = sign_in_attempts.failures + 1
     returning key, failures`,
    keys.flatMap((key) => [key, start]),
  )) as { rows: { key: string; failures: number }[] };
  // Old windows are of no use; keep the table small.
  await q('sign_in_attempts').where('window_start', '<', new Date(start.getTime() - 24 * 3600_000)).del();
  const over = rows.some((r) =>
    r.key.startsWith('email:') ? r.failures > signInLimits.perAccount : r.failures > signInLimits.perAddress,
  );
  const waitSeconds = over
    ? Math.max(1, Math.ceil((start.getTime() + signInLimits.windowMinutes * 60_000 - now.getTime()) / 1000))
    : 0;
  return { email, address, windowStart: start, waitSeconds };
}

/** The password was right: the account's failures are forgotten and the address's count is taken back. */
export async function signInSucceeded(attempt: SignInAttempt, q: Db = db()): Promise<void> {
  await q('sign_in_attempts').where('key', `email:${attempt.email}`).del();
  if (attempt.address !== null) {
    await q('sign_in_attempts')
      .where({ key: `ip:${attempt.address}`, window_start: attempt.windowStart })
      .update({ failures: q.raw('greatest(failures - 1, 0)') });
  }
}
