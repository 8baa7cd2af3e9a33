import { db, type Db } from './knex';

/** Limits on failed sign-ins, per window. Common practice, no published source. */
export const signInLimits = { windowMinutes: 15, perAccount: 5, perAddress: 30 } as const;

function windowStart(now: Date): Date {
  const ms = signInLimits.windowMinutes * 60_000;
  return new Date(Math.floor(now.getTime() / ms) * ms);
}

/** Adds one to a counter of this window, in one statement, and answers the new count. */
async function countOne(q: Db, key: string, start: Date): Promise<number> {
  const { rows } = (await q.raw(
    `insert into sign_in_attempts (key, window_start, failures) values (?, ?, 1)
     on conflict (key, window_start) do update set failures = sign_in_attempts.failures + 1
     returning failures`,
    [key, start],
  )) as { rows: { failures: number }[] };
  return rows[0]!.failures;
}

async function takeOneBack(q: Db, key: string, start: Date): Promise<void> {
  await q('sign_in_attempts').where({ key, window_start: start }).update({ failures: q.raw('greatest(failures - 1, 0)') });
}

/** One password check, counted as a failure before the password is compared. */
export type SignInAttempt = { email: string; address: string | null; windowStart: Date; waitSeconds: number };

/**
 * Counts a password check as a failure up front and then compares the count with the limit: the
 * account's count first, then the address's when the address is known (an unknown address has no
 * counter: it would be one counter for everybody). Each count is raised and read in one statement,
 * so parallel attempts each get their own number and a burst cannot pass the limit. `waitSeconds` is
 * 0 when the check may go ahead, otherwise the seconds until the window ends; a refused attempt adds
 * nothing to the other counter. A check that turns out right is taken back with `signInSucceeded`.
 */
export async function reserveSignInAttempt(email: string, address: string | null, now = new Date(), q: Db = db()): Promise<SignInAttempt> {
  const start = windowStart(now);
  const attempt: SignInAttempt = { email, address, windowStart: start, waitSeconds: 0 };
  const refused = (): SignInAttempt => ({
    ...attempt,
    waitSeconds: Math.max(1, Math.ceil((start.getTime() + signInLimits.windowMinutes * 60_000 - now.getTime()) / 1000)),
  });
  // Old windows are of no use; keep the table small.
  await q('sign_in_attempts').where('window_start', '<', new Date(start.getTime() - 24 * 3600_000)).del();
  if ((await countOne(q, `email:${email}`, start)) > signInLimits.perAccount) return refused();
  if (address !== null && (await countOne(q, `ip:${address}`, start)) > signInLimits.perAddress) {
    await takeOneBack(q, `email:${email}`, start);
    return refused();
  }
  return attempt;
}

/** The password was right: the account's failures are forgotten and the address's count is taken back. */
export async function signInSucceeded(attempt: SignInAttempt, q: Db = db()): Promise<void> {
  await q('sign_in_attempts').where('key', `email:${attempt.email}`).del();
  if (attempt.address !== null) await takeOneBack(q, `ip:${attempt.address}`, attempt.windowStart);
}
