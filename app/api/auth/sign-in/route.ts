import bcrypt from 'bcryptjs';
import { NextResponse } from 'next/server';
import { route, parseBody, jsonError } from '@/lib/api/handler';
import { signInSchema } from '@/lib/validations/auth';
import { findUserForSignIn } from '@/lib/db/users';
import { reserveSignInAttempt, signInSucceeded } from '@/lib/db/sign-in-attempts';
import { startSession } from '@/lib/auth/session';
import { clientAddress } from '@/lib/api/client-address';

// A hash to compare against when the account does not exist, so timing does not reveal it.
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.jhN0Yk0xk/3bJ7yl0Pq6J8QE8wH2';

export const POST = route(async (req) => {
  const { email, password } = await parseBody(req, signInSchema);
  const attempt = await reserveSignInAttempt(email, clientAddress(req));
  const wait = attempt.waitSeconds;
  if (wait > 0) {
    return NextResponse.json(
      { error: `Too many failed sign-ins. Try again in ${Math.ceil(wait / 60)} minutes.` },
      { status: 429, headers: { 'Retry-After': String(wait) } },
    );
  }
  const user = await findUserForSignIn(email);
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  // The attempt already counts as a failure.
  if (!user || !ok || !user.active) return jsonError(401, 'E-mail or password is not right.');
  await signInSucceeded(attempt);
  await startSession(user.id, req.headers.get('user-agent'));
  return NextResponse.json({ user: { id: user.id, name: user.name, email: user.email, role: user.role, studioName: user.studioName } });
});
