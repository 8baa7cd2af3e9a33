import { NextResponse, after } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { createMillPackJob, runMillPackJob } from '@/lib/db/mill-pack-jobs';
import { objectStore } from '@/lib/storage/object-store';
import { millPackStartSchema, styleIdParamSchema } from '@/lib/validations/mill';

/** Starts building the mill pack PDF on the server; poll the job for progress. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('mill:download');
  const { id } = styleIdParamSchema.parse(params);
  const input = await parseBody(req, millPackStartSchema);
  const job = await createMillPackJob(user, id, input);
  after(() => runMillPackJob(job.id, objectStore()));
  return NextResponse.json({ job }, { status: 202 });
});
