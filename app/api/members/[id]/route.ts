import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { countActiveAdmins, findMember, updateMember } from '@/lib/db/users';
import { organisationForRole } from '@/lib/db/organisations';
import { memberPatchSchema } from '@/lib/validations/auth';
import { idParamSchema } from '@/lib/validations/style';
import { HttpError, notFound } from '@/lib/api/errors';
import { writeAudit } from '@/lib/db/audit';

export const PATCH = route<{ id: string }>(async (req, params) => {
  const user = await authorize('members:manage');
  const { id } = idParamSchema.parse(params);
  const patch = await parseBody(req, memberPatchSchema);
  const member = await findMember(user.studioId, id);
  if (!member) throw notFound('Member not found.');
  const losesAdmin = member.role === 'admin' && member.active && (patch.active === false || (patch.role && patch.role !== 'admin'));
  if (losesAdmin && (await countActiveAdmins(user.studioId)) <= 1) {
    throw new HttpError(400, 'The studio needs at least one active admin.', { fieldErrors: { role: ['Keep at least one active admin'] } });
  }
  // A new role or organisation must fit together: mill accounts to a mill, client accounts to a client.
  if (patch.role !== undefined || patch.organisationId !== undefined) {
    const organisationId = patch.organisationId !== undefined ? patch.organisationId : member.organisationId;
    patch.organisationId = await organisationForRole(user.studioId, patch.role ?? member.role, organisationId);
  }
  await updateMember(user.studioId, id, patch);
  await writeAudit({ studioId: user.studioId, userId: user.id, action: 'member.update', details: { email: member.email, ...patch } });
  return NextResponse.json({ member: await findMember(user.studioId, id) });
});
