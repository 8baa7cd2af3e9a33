import 'server-only';
import { jobQueue, queues } from './queue';
import { runMillPackJob } from '@/lib/db/mill-pack-jobs';
import { objectStore } from '@/lib/storage/object-store';

const g = globalThis as unknown as { needlemapWorkers?: boolean };

/**
 * Starts this process's workers. Called once when the server starts; while PostgreSQL cannot be
 * reached it tries again every few seconds, so a server started before its database still works.
 */
export async function startJobWorkers(retryMs = 5000): Promise<void> {
  if (g.needlemapWorkers) return;
  try {
    const boss = await jobQueue();
    await boss.work<{ jobId: string }>(queues.millPack.name, { pollingIntervalSeconds: 1, includeMetadata: true }, async ([job]) => {
      if (!job) return;
      // A retry means the first attempt's server stopped mid-build: the pack is taken over from where it was left.
      await runMillPackJob(job.data.jobId, objectStore(), undefined, { takeOver: job.retryCount > 0 });
    });
    g.needlemapWorkers = true;
  } catch (err) {
    console.error('Job workers could not start yet:', err instanceof Error ? err.message : err);
    setTimeout(() => void startJobWorkers(retryMs), retryMs).unref();
  }
}
