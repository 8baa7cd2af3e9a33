'use client';

import { useEffect, useRef, useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import type { MillPackJob } from '@/lib/db/mill-pack-jobs';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';

/** Starts the server-side mill pack and shows its progress until the file can be downloaded. */
export function PackBuilder({ styleId, releaseId, paper, label }: { styleId: string; releaseId: string | null; paper: 'a4' | 'letter'; label: string }) {
  const [job, setJob] = useState<MillPackJob | null>(null);
  const [error, setError] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);

  const poll = (id: string) => {
    timer.current = setTimeout(async () => {
      try {
        const { job: j } = await api<{ job: MillPackJob }>(`/api/mill-pack-jobs/${id}`);
        setJob(j);
        if (j.status === 'queued' || j.status === 'running') poll(id);
      } catch (err) {
        setError(err instanceof ApiError ? err.message : 'Lost track of the pack; try again.');
      }
    }, 400);
  };

  const start = async () => {
    setError(null);
    try {
      const { job: j } = await api<{ job: MillPackJob }>(`/api/styles/${styleId}/mill-pack`, { method: 'POST', json: { releaseId, paper } });
      setJob(j);
      poll(j.id);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'The pack could not be started.');
    }
  };

  const busy = job && (job.status === 'queued' || job.status === 'running');
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="primary" onClick={start} disabled={!!busy}>{busy ? 'Building…' : label}</Button>
        {job?.status === 'done' && job.fileId ? (
          <a className="text-sm font-medium text-spruce-700 underline" href={`/api/files/${job.fileId}`}>
            Download the mill pack ({job.pages} pages, PDF)
          </a>
        ) : null}
      </div>
      {busy ? (
        <div aria-live="polite">
          <div className="h-2 w-full max-w-md overflow-hidden rounded-full bg-rule" role="progressbar" aria-label="Mill pack progress" aria-valuenow={job.progress} aria-valuemin={0} aria-valuemax={100}>
            <div className="h-full bg-spruce-500 transition-[width]" style={{ width: `${job.progress}%` }} />
          </div>
          <p className="mt-1 text-xs text-ink-soft"><span className="figures">{job.progress} %</span> · {job.step}</p>
        </div>
      ) : null}
      {job?.status === 'failed' ? <Notice tone="error">The pack could not be built: {job.error}</Notice> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
    </div>
  );
}
