import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { findStyle } from '@/lib/db/styles';
import { listStyleAudit } from '@/lib/db/audit';
import { idParamSchema } from '@/lib/validations/style';
import { forbidden, notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';

export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('style:read');
  if (isOutsideRole(user.role)) throw forbidden();
  const { id } = idParamSchema.parse(params);
  if (!(await findStyle(user, id))) throw notFound('Style not found.');
  return NextResponse.json({ entries: await listStyleAudit(user.studioId, id) });
});
