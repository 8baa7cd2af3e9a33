/** Runs once when a server process starts: the background job workers (Node runtime only). */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs' && process.env.NEEDLEMAP_JOB_WORKERS !== 'off') {
    const { startJobWorkers } = await import('@/lib/jobs/workers');
    await startJobWorkers();
  }
}
