import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { listBriefVersions } from '@/lib/db/briefs';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

/** The brief's earlier versions with what changed: studio staff only (the answers hold prices). */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('quote:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json({ versions: await listBriefVersions(user, id) });
});
