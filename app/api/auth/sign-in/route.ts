import bcrypt from 'bcryptjs';
import { NextResponse } from 'next/server';
import { route, parseBody, jsonError } from '@/lib/api/handler';
import { signInSchema } from '@/lib/validations/auth';
import { findUserForSignIn } from '@/lib/db/users';
import { clearSignInFailures, recordSignInFailure, signInBlockedFor } from '@/lib/db/sign-in-attempts';
import { startSession } from '@/lib/auth/session';
import { clientAddress } from '@/lib/api/client-address';

// A hash to compare against when the account does not exist, so timing does not reveal it.
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.jhN0Yk0xk/3bJ7yl0Pq6J8QE8wH2';

export const POST = route(async (req) => {
  const { email, password } = await parseBody(req, signInSchema);
  const address = clientAddress(req);
  const wait = await signInBlockedFor(email, address);
  if (wait > 0) {
    return NextResponse.json(
      { error: `Too many failed sign-ins. Try again in ${Math.ceil(wait / 60)} minutes.` },
      { status: 429, headers: { 'Retry-After': String(wait) } },
    );
  }
  const user = await findUserForSignIn(email);
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok || !user.active) {
    await recordSignInFailure(email, address);
    return jsonError(401, 'E-mail or password is not right.');
  }
  await clearSignInFailures(email);
  await startSession(user.id, req.headers.get('user-agent'));
  return NextResponse.json({ user: { id: user.id, name: user.name, email: user.email, role: user.role, studioName: user.studioName } });
});
