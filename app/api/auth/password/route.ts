import bcrypt from 'bcryptjs';
import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorizeSession } from '@/lib/auth/authorize';
import { passwordChangeSchema } from '@/lib/validations/auth';
import { changePassword, findPasswordHash } from '@/lib/db/users';
import { reserveSignInAttempt, signInSucceeded } from '@/lib/db/sign-in-attempts';
import { writeAudit } from '@/lib/db/audit';
import { clientAddress } from '@/lib/api/client-address';
import { HttpError } from '@/lib/api/errors';

/** Changes the caller's own password and ends the account's other sessions; this one stays signed in. */
export const POST = route(async (req) => {
  const { user, sessionId } = await authorizeSession();
  const { currentPassword, newPassword } = await parseBody(req, passwordChangeSchema);
  // A wrong current password counts as a failed sign-in, so a taken-over session cannot guess it freely.
  const attempt = await reserveSignInAttempt(user.email, clientAddress(req));
  const wait = attempt.waitSeconds;
  if (wait > 0) {
    return NextResponse.json(
      { error: `Too many wrong passwords. Try again in ${Math.ceil(wait / 60)} minutes.` },
      { status: 429, headers: { 'Retry-After': String(wait) } },
    );
  }
  const hash = await findPasswordHash(user.id);
  if (!hash || !(await bcrypt.compare(currentPassword, hash))) {
    throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { currentPassword: ['This is not your current password'] } });
  }
  await signInSucceeded(attempt);
  const endedSessions = await changePassword(user.id, await bcrypt.hash(newPassword, 10), sessionId);
  await writeAudit({ studioId: user.studioId, userId: user.id, action: 'member.password', details: { email: user.email, endedSessions } });
  return NextResponse.json({ ok: true, endedSessions });
});
