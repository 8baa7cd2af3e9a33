import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadBrief, saveBrief } from '@/lib/db/briefs';
import { briefSaveSchema } from '@/lib/validations/brief';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

/** The brief: studio staff, and client reviewers of a shared style (without prices). Not the mill. */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('brief:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json({ brief: await loadBrief(user, id) });
});

/** Saves the brief at its version (0 for the first save); a stale version gets 409. */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, briefSaveSchema);
  return NextResponse.json({ brief: await saveBrief(user, id, input) });
});
