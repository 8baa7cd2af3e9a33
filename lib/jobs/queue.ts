import 'server-only';
import PgBoss from 'pg-boss';
import config from '@/knexfile';

/**
 * Work that takes longer than a request should (building a mill pack) goes through a job queue kept
 * in PostgreSQL: any app server may take a job, a job whose server died is handed out again once it
 * expires, and nothing is lost when one process stops. The queue lives in a schema of its own,
 * created and kept up to date by the queue library itself.
 */
export const queueSchema = 'job_queue';

/** The queues, with how their jobs are retried and how long one may run before it is handed out again. */
export const queues = {
  millPack: { name: 'mill-pack', retryLimit: 2, retryDelay: 5, expireInSeconds: 10 * 60 },
} as const;
export type QueueName = (typeof queues)[keyof typeof queues]['name'];

const g = globalThis as unknown as { needlemapQueue?: Promise<PgBoss> };

async function start(): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: process.env.DATABASE_URL ?? (config.connection as string),
    schema: queueSchema,
    max: 3,
    application_name: 'needlemap-jobs',
  });
  // The queue reports lost connections here (for instance while PostgreSQL restarts); it carries on by itself.
  boss.on('error', (err: Error) => console.error('Job queue:', err.message));
  await boss.start();
  for (const q of Object.values(queues)) await boss.createQueue(q.name, { ...q });
  return boss;
}

/** The process's queue client, started once (a failed start is tried again on the next call). */
export function jobQueue(): Promise<PgBoss> {
  g.needlemapQueue ??= start().catch((err: unknown) => {
    g.needlemapQueue = undefined;
    throw err;
  });
  return g.needlemapQueue;
}

/** Puts a job on a queue; its id in the queue. */
export async function enqueue(name: QueueName, data: Record<string, string>): Promise<string | null> {
  return (await jobQueue()).send(name, data);
}
