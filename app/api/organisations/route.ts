import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { listOrganisations } from '@/lib/db/organisations';
import { forbidden } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';

export const GET = route(async () => {
  const user = await authorize('style:read');
  if (isOutsideRole(user.role)) throw forbidden();
  return NextResponse.json({ organisations: await listOrganisations(user.studioId) });
});
