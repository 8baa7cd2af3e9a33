import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { findMillPackJob } from '@/lib/db/mill-pack-jobs';
import { jobParamsSchema } from '@/lib/validations/mill';

/** A mill pack being built: status, percent and step; the file id once done. */
export const GET = route<{ id: string }>(async (_req, params) => {
  const user = await authorize('mill:download');
  const { id } = jobParamsSchema.parse(params);
  return NextResponse.json({ job: await findMillPackJob(user, id) });
});
