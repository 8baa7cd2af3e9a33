import bcrypt from 'bcryptjs';
import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { insertMember, listMembers, findMember } from '@/lib/db/users';
import { organisationForRole } from '@/lib/db/organisations';
import { memberCreateSchema } from '@/lib/validations/auth';
import { HttpError } from '@/lib/api/errors';
import { writeAudit } from '@/lib/db/audit';

export const GET = route(async () => {
  const user = await authorize('members:manage');
  return NextResponse.json({ members: await listMembers(user.studioId) });
});

export const POST = route(async (req) => {
  const user = await authorize('members:manage');
  const input = await parseBody(req, memberCreateSchema);
  const organisationId = await organisationForRole(user.studioId, input.role, input.organisationId);
  const passwordHash = await bcrypt.hash(input.password, 10);
  let id: string;
  try {
    id = await insertMember(user.studioId, { ...input, organisationId, passwordHash });
  } catch (err) {
    if ((err as { code?: string }).code === '23505') {
      throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { email: ['An account with this e-mail exists'] } });
    }
    throw err;
  }
  await writeAudit({ studioId: user.studioId, userId: user.id, action: 'member.add', details: { email: input.email, role: input.role } });
  return NextResponse.json({ member: await findMember(user.studioId, id) }, { status: 201 });
});
