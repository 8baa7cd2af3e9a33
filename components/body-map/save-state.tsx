'use client';

import type { SaveStatus } from './use-autosave';

export function SaveState({ status, onReload, onKeepCopy, onOverwrite }: { status: SaveStatus; onReload: () => void; onKeepCopy: () => void; onOverwrite: () => void }) {
  const base = 'inline-flex items-center gap-2 rounded-md px-2 py-1 text-xs font-medium';
  switch (status.kind) {
    case 'read-only':
      return <span data-testid="save-state" data-state="read-only" className={`${base} bg-rule/60 text-ink-soft`}>Read only</span>;
    case 'saved':
      return <span data-testid="save-state" data-state="saved" className={`${base} text-spruce-700`}>● Saved{status.at ? ` ${status.at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}` : ''}</span>;
    case 'unsaved':
      return <span data-testid="save-state" data-state="unsaved" className={`${base} text-ochre-700`}>● Unsaved changes</span>;
    case 'saving':
      return <span data-testid="save-state" data-state="saving" className={`${base} text-ink-soft`}>Saving…</span>;
    case 'retrying':
      return (
        <span data-testid="save-state" data-state="retrying" role="alert" className={`${base} bg-ochre-50 text-ochre-700`}>
          Not saved — retrying in {Math.round(status.nextInMs / 1000)} s ({status.message})
        </span>
      );
    case 'invalid':
      return <span data-testid="save-state" data-state="invalid" role="alert" className={`${base} bg-madder-50 text-madder-700`}>Not saved: {status.message}</span>;
    case 'conflict':
      return (
        <span data-testid="save-state" data-state="conflict" role="alert" className={`${base} bg-madder-50 text-madder-700`}>
          Conflict: {status.message}
          <button type="button" className="rounded border border-madder-500/40 bg-panel px-1.5 py-0.5" onClick={onReload}>Reload latest</button>
          <button type="button" className="rounded border border-madder-500/40 bg-panel px-1.5 py-0.5" onClick={onKeepCopy}>Keep my copy</button>
          <button
            type="button"
            className="rounded border border-madder-500/40 bg-panel px-1.5 py-0.5"
            onClick={() => { if (window.confirm('Replace the newer saved map with yours? Their changes will be lost.')) onOverwrite(); }}
          >
            Save mine over it
          </button>
        </span>
      );
  }
}

/** The offer to bring back work kept in this browser that never reached the server. */
export function RestoreOffer({ savedAt, onRestore, onDiscard }: { savedAt: number; onRestore: () => void; onDiscard: () => void }) {
  const at = new Date(savedAt);
  const when = at.toLocaleDateString() === new Date().toLocaleDateString()
    ? at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })
    : at.toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' });
  return (
    <div data-testid="restore-offer" role="alert" className="flex flex-wrap items-center gap-2 border-b border-rule bg-ochre-50 px-2 py-1 text-xs text-ochre-700">
      Unsaved work from {when} is kept in this browser.
      <button type="button" className="rounded border border-ochre-500/40 bg-panel px-1.5 py-0.5" onClick={onRestore}>Restore unsaved work</button>
      <button type="button" className="rounded border border-ochre-500/40 bg-panel px-1.5 py-0.5" onClick={onDiscard}>Discard</button>
    </div>
  );
}
