import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { HttpError } from '@/lib/api/errors';
import { createMillPackJob, failMillPackJob } from '@/lib/db/mill-pack-jobs';
import { enqueue, queues } from '@/lib/jobs/queue';
import { millPackStartSchema, styleIdParamSchema } from '@/lib/validations/mill';

/** Starts building the mill pack PDF: the job goes on the queue; poll it for progress. */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('mill:download');
  const { id } = styleIdParamSchema.parse(params);
  const input = await parseBody(req, millPackStartSchema);
  const job = await createMillPackJob(user, id, input);
  try {
    await enqueue(queues.millPack.name, { jobId: job.id });
  } catch (err) {
    console.error('Mill pack: the job could not be queued', err);
    await failMillPackJob(job.id, 'The job queue could not be reached; nothing was built.').catch(() => {});
    throw new HttpError(503, 'The mill pack could not be started just now. Try again in a moment.');
  }
  return NextResponse.json({ job }, { status: 202 });
});
