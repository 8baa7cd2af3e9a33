import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { setStudioRuleLimits, studioRuleLimits } from '@/lib/db/rule-limits';
import { ruleLimitsPutSchema } from '@/lib/validations/rule-limits';

/** The studio's float and tuck-stack limits for its machines, each with where it comes from. Studio staff read. */
export const GET = route(async () => {
  const user = await authorize('library:read');
  return NextResponse.json({ machineLimits: await studioRuleLimits(user.studioId) });
});

/** Admin only. */
export const PUT = route(async (req) => {
  const user = await authorize('studio:settings');
  const { limits } = await parseBody(req, ruleLimitsPutSchema);
  return NextResponse.json({ machineLimits: await setStudioRuleLimits(user, limits) });
});
