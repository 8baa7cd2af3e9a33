'use client';

import { useEffect, useRef, useState } from 'react';
import type { SampleRoundPhoto } from '@/lib/db/fit';
import { Button } from '@/components/ui/button';

function megabytes(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(bytes < 1024 * 1024 ? 2 : 1)} MB`;
}

/** One photo of a set at full size, in a modal dialog: ← and → step through the set, Esc closes. */
export function PhotoViewer({ title, photos, start, onClose }: { title: string; photos: SampleRoundPhoto[]; start: number; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const [index, setIndex] = useState(start);
  const photo = photos[Math.min(index, photos.length - 1)];

  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
  }, []);
  useEffect(() => {
    if (!photo) onClose();
  }, [photo, onClose]);
  if (!photo) return null;

  const step = (by: number) => setIndex((i) => (i + by + photos.length) % photos.length);
  return (
    <dialog
      ref={ref}
      aria-label={`Photo ${index + 1} of ${photos.length}, ${title}`}
      className="m-auto max-h-[96vh] max-w-[96vw] rounded-[var(--radius-card)] border border-rule bg-panel p-0 shadow-xl backdrop:bg-[rgba(31,36,40,0.72)]"
      onClose={onClose}
      onKeyDown={(e) => {
        if (photos.length < 2) return;
        if (e.key === 'ArrowRight') { e.preventDefault(); step(1); }
        if (e.key === 'ArrowLeft') { e.preventDefault(); step(-1); }
      }}
      // A click on the backdrop lands on the dialog itself.
      onClick={(e) => { if (e.target === e.currentTarget) ref.current?.close(); }}
    >
      <div className="flex items-center justify-between gap-3 border-b border-rule px-3 py-2">
        <div className="min-w-0 text-sm">
          <span className="font-semibold">{title}</span>
          <span className="text-ink-faint"> · photo {index + 1} of {photos.length}</span>
        </div>
        <div className="flex items-center gap-1">
          {photos.length > 1 ? (
            <>
              <Button size="sm" variant="ghost" aria-label="Previous photo" onClick={() => step(-1)}>←</Button>
              <Button size="sm" variant="ghost" aria-label="Next photo" onClick={() => step(1)}>→</Button>
            </>
          ) : null}
          <a href={photo.url} target="_blank" rel="noreferrer" className="rounded-md px-2.5 py-1 text-xs font-medium text-ink-soft hover:bg-rule/60">Open original</a>
          <Button size="sm" variant="ghost" autoFocus onClick={() => ref.current?.close()}>Close</Button>
        </div>
      </div>
      <div className="flex items-center justify-center bg-paper">
        {/* eslint-disable-next-line @next/next/no-img-element -- private images served by our own route */}
        <img src={photo.url} alt={photo.name || `Photo ${index + 1}`} data-testid="photo-full" className="block max-h-[calc(96vh-5.5rem)] max-w-[96vw] object-contain" />
      </div>
      <div className="figures border-t border-rule px-3 py-1.5 text-2xs text-ink-faint">
        <span className="font-sans text-ink-soft">{photo.name || 'Unnamed photo'}</span>
        {photo.widthPx && photo.heightPx ? <> · {photo.widthPx} × {photo.heightPx} px</> : null}
        {' '}· {megabytes(photo.byteSize)} · <span className="font-sans">added by {photo.uploadedBy ?? '—'}</span> {photo.createdAt.slice(0, 10)}
      </div>
    </dialog>
  );
}
