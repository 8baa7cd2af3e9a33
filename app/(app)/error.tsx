'use client';

import { useEffect } from 'react';
import { Button } from '@/components/ui/button';

/** Shown when a page of the app fails (for example while the database restarts). Nothing saved is lost. */
export default function AppError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="mx-auto mt-16 max-w-md rounded-[var(--radius-card)] border border-rule bg-panel p-6 text-center">
      <h1 className="text-base font-semibold">This page could not be loaded</h1>
      <p className="mt-2 text-sm text-ink-soft">
        The server or its database may be restarting. Nothing that was saved is lost. Try again in a moment.
      </p>
      <div className="mt-4 flex justify-center gap-2">
        <Button variant="primary" onClick={() => reset()}>Try again</Button>
        <Button variant="ghost" onClick={() => window.location.reload()}>Reload the page</Button>
      </div>
      {error.digest ? <p className="figures mt-3 text-xs text-ink-faint">Reference {error.digest}</p> : null}
    </div>
  );
}
