'use client';

import { useRef, useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import type { FitDocument, SampleRound, SampleRoundPhoto } from '@/lib/db/fit';
import { uploadLimits } from '@/lib/files/limits';
import { Button } from '@/components/ui/button';
import { PhotoViewer } from './photo-viewer';

const accept = 'image/png,image/jpeg,image/webp';

/** A row of thumbnails that open full size; `size` is the side of a thumbnail in px. */
export function PhotoThumbnails({ title, photos, size = 80, onRemove, removing, className = '' }: {
  title: string; photos: SampleRoundPhoto[]; size?: number; onRemove?: (p: SampleRoundPhoto) => void; removing?: string | null; className?: string;
}) {
  const [open, setOpen] = useState<number | null>(null);
  return (
    <>
      <ul className={`flex flex-wrap gap-2 ${className}`} aria-label={`Photos of ${title}`}>
        {photos.map((p, i) => (
          <li key={p.id} className="group relative" data-testid="round-photo">
            <button
              type="button"
              onClick={() => setOpen(i)}
              className="block overflow-hidden rounded-md border border-rule bg-paper focus-visible:outline-2 focus-visible:outline-spruce-600"
              style={{ width: size, height: size }}
              aria-label={`Open photo ${i + 1}${p.name ? `, ${p.name}` : ''}`}
              title={p.name}
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- private images served by our own route */}
              <img src={p.url} alt="" loading="lazy" decoding="async" className="h-full w-full object-cover" />
            </button>
            {onRemove ? (
              <button
                type="button"
                aria-label={`Remove photo ${i + 1}${p.name ? `, ${p.name}` : ''}`}
                disabled={removing === p.id}
                onClick={() => onRemove(p)}
                className="absolute -right-1.5 -top-1.5 hidden h-5 w-5 items-center justify-center rounded-full border border-rule-strong bg-panel text-xs leading-none text-madder-700 shadow-sm hover:bg-madder-50 focus-visible:flex group-hover:flex disabled:opacity-50"
              >
                ×
              </button>
            ) : null}
          </li>
        ))}
      </ul>
      {open !== null ? <PhotoViewer title={title} photos={photos} start={open} onClose={() => setOpen(null)} /> : null}
    </>
  );
}

/**
 * A round's photos: thumbnails that open full size, and for those who record rounds, adding
 * (choose or drop several; each is checked by content on the server) and removing.
 */
export function RoundPhotos({ doc, round, title, readOnly, onDoc }: {
  doc: FitDocument; round: SampleRound; title: string; readOnly: boolean; onDoc: (doc: FitDocument) => void;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<string | null>(null);
  const [errors, setErrors] = useState<string[]>([]);
  const [removing, setRemoving] = useState<string | null>(null);
  const [over, setOver] = useState(false);

  async function upload(files: File[]) {
    if (!files.length) return;
    const problems: string[] = [];
    setErrors([]);
    for (const [i, f] of files.entries()) {
      if (f.size > uploadLimits.photo) {
        problems.push(`${f.name}: larger than ${uploadLimits.photo / 1024 / 1024} MB, not sent.`);
        continue;
      }
      setProgress(files.length > 1 ? `Adding photo ${i + 1} of ${files.length}…` : 'Adding the photo…');
      const form = new FormData();
      form.set('photo', f);
      try {
        onDoc((await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds/${round.id}/photos`, { method: 'POST', body: form })).fit);
      } catch (err) {
        problems.push(`${f.name}: ${err instanceof ApiError ? (err.fieldErrors.photo?.[0] ?? err.message) : 'the upload failed.'}`);
      }
    }
    setProgress(null);
    setErrors(problems);
    if (input.current) input.current.value = '';
  }

  async function remove(p: SampleRoundPhoto) {
    if (!window.confirm(`Remove ${p.name || 'this photo'} from ${title}? The stored image is deleted.`)) return;
    setRemoving(p.id);
    setErrors([]);
    try {
      onDoc((await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds/${round.id}/photos/${p.id}`, { method: 'DELETE' })).fit);
    } catch (err) {
      setErrors([err instanceof ApiError ? err.message : 'The photo was not removed.']);
    } finally {
      setRemoving(null);
    }
  }

  const busy = progress !== null;
  // Those who only read see the section when there is something in it.
  if (readOnly && round.photos.length === 0) return null;
  const dropProps = readOnly ? {} : {
    onDragOver: (e: React.DragEvent) => { if (e.dataTransfer.types.includes('Files')) { e.preventDefault(); setOver(true); } },
    onDragLeave: () => setOver(false),
    onDrop: (e: React.DragEvent) => { e.preventDefault(); setOver(false); if (!busy) void upload([...e.dataTransfer.files]); },
  };

  return (
    <section aria-label="Photos" {...dropProps} className={`rounded-md ${over ? 'outline-2 outline-dashed outline-spruce-500' : ''}`}>
      <div className="mb-1 flex items-center gap-2">
        <h4 className="text-xs font-semibold uppercase tracking-[0.06em] text-ink-soft">Photos</h4>
        {round.photos.length ? <span className="figures text-2xs text-ink-faint">{round.photos.length}</span> : null}
        {readOnly ? null : (
          <>
            <input
              ref={input}
              type="file"
              multiple
              accept={accept}
              aria-label={`Add photos to ${title}`}
              className="sr-only"
              onChange={(e) => void upload([...(e.target.files ?? [])])}
            />
            <Button size="sm" variant="ghost" disabled={busy} onClick={() => input.current?.click()}>+ Add photos</Button>
            {progress ? <span role="status" className="text-xs text-ink-soft">{progress}</span> : null}
          </>
        )}
      </div>
      {round.photos.length ? (
        <PhotoThumbnails title={title} photos={round.photos} onRemove={readOnly ? undefined : remove} removing={removing} />
      ) : (
        <p className="text-sm text-ink-faint">
          No photos yet: drop photos of the sample here, or add them (PNG, JPEG or WebP, up to 10 MB each).
        </p>
      )}
      {errors.length ? (
        <ul role="alert" className="mt-1.5 space-y-0.5 text-xs text-madder-700">
          {errors.map((e) => <li key={e}>{e}</li>)}
        </ul>
      ) : null}
    </section>
  );
}
