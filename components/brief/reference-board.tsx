'use client';

import { useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api/client';
import type { BriefReference } from '@/lib/db/briefs';
import { referenceTags, type ReferenceTag } from '@/lib/validations/brief';
import { Button } from '@/components/ui/button';
import { Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/card';
import { referencesKey } from './use-brief';

export function ReferenceBoard({ styleId, references, readOnly }: { styleId: string; references: BriefReference[]; readOnly: boolean }) {
  const qc = useQueryClient();
  const fileRef = useRef<HTMLInputElement>(null);
  const [caption, setCaption] = useState('');
  const [tag, setTag] = useState<ReferenceTag>('colour');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (refs: BriefReference[]) => qc.setQueryData(referencesKey(styleId), refs);

  async function upload() {
    const file = fileRef.current?.files?.[0];
    if (!file) { setError('Choose an image first.'); return; }
    setBusy(true);
    setError(null);
    const form = new FormData();
    form.set('file', file);
    form.set('caption', caption);
    form.set('tag', tag);
    try {
      await api(`/api/styles/${styleId}/brief/references`, { method: 'POST', body: form });
      setCaption('');
      if (fileRef.current) fileRef.current.value = '';
      await qc.invalidateQueries({ queryKey: referencesKey(styleId) });
    } catch (x) {
      setError(x instanceof ApiError ? (x.fieldErrors.file?.[0] ?? x.fieldErrors.tag?.[0] ?? x.message) : 'The upload failed.');
    } finally {
      setBusy(false);
    }
  }

  async function move(i: number, by: number) {
    const ids = references.map((r) => r.id);
    const j = i + by;
    if (j < 0 || j >= ids.length) return;
    [ids[i], ids[j]] = [ids[j]!, ids[i]!];
    try {
      set((await api<{ references: BriefReference[] }>(`/api/styles/${styleId}/brief/references/order`, { method: 'PUT', json: { ids } })).references);
    } catch (x) {
      setError(x instanceof ApiError ? x.message : 'Could not reorder.');
      await qc.invalidateQueries({ queryKey: referencesKey(styleId) });
    }
  }

  async function patch(r: BriefReference, body: { caption?: string; tag?: ReferenceTag }) {
    try {
      const res = await api<{ reference: BriefReference }>(`/api/styles/${styleId}/brief/references/${r.id}`, { method: 'PATCH', json: body });
      set(references.map((x) => (x.id === r.id ? res.reference : x)));
    } catch (x) {
      setError(x instanceof ApiError ? x.message : 'Could not save.');
    }
  }

  async function remove(r: BriefReference) {
    try {
      await api(`/api/styles/${styleId}/brief/references/${r.id}`, { method: 'DELETE' });
      await qc.invalidateQueries({ queryKey: referencesKey(styleId) });
    } catch (x) {
      setError(x instanceof ApiError ? x.message : 'Could not remove.');
    }
  }

  return (
    <div className="space-y-3" data-testid="reference-board">
      {readOnly ? null : (
        <div className="flex flex-wrap items-end gap-2">
          <label className="text-xs font-medium text-ink-soft">Image (PNG, JPEG or WebP, up to 10 MB)
            <input ref={fileRef} type="file" accept="image/png,image/jpeg,image/webp" aria-label="Reference image" className="mt-1 block text-sm" />
          </label>
          <Input aria-label="Caption" placeholder="Caption" value={caption} onChange={(e) => setCaption(e.target.value)} className="w-56" maxLength={200} />
          <Select aria-label="Tag" value={tag} onChange={(e) => setTag(e.target.value as ReferenceTag)} className="w-36">
            {referenceTags.map((t) => <option key={t} value={t}>{t}</option>)}
          </Select>
          <Button type="button" onClick={upload} disabled={busy}>{busy ? 'Uploading…' : 'Add to board'}</Button>
        </div>
      )}
      {error ? <Notice tone="error">{error}</Notice> : null}
      {references.length === 0 ? <p className="text-sm text-ink-faint">No reference images yet.</p> : (
        <ul className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-4">
          {references.map((r, i) => (
            <li key={r.id} className="overflow-hidden rounded-md border border-rule bg-paper" data-testid="reference">
              {/* eslint-disable-next-line @next/next/no-img-element -- private images served by our own route */}
              <img src={r.url} alt={r.caption || r.originalName || 'Reference image'} className="aspect-[4/3] w-full bg-rule/40 object-cover" />
              <div className="space-y-1.5 p-2 text-xs">
                {readOnly ? (
                  <>
                    <div className="text-ink">{r.caption || '—'}</div>
                    <span className="rounded bg-rule/60 px-1.5 py-0.5 text-ink-soft">{r.tag}</span>
                  </>
                ) : (
                  <>
                    <Input aria-label={`Caption of image ${i + 1}`} defaultValue={r.caption} maxLength={200} onBlur={(e) => e.target.value !== r.caption && patch(r, { caption: e.target.value })} className="h-7 text-xs" />
                    <div className="flex items-center gap-1">
                      <Select aria-label={`Tag of image ${i + 1}`} value={r.tag} onChange={(e) => patch(r, { tag: e.target.value as ReferenceTag })} className="h-7 w-28 text-xs">
                        {referenceTags.map((t) => <option key={t} value={t}>{t}</option>)}
                      </Select>
                      <Button type="button" size="sm" variant="ghost" aria-label={`Move image ${i + 1} earlier`} disabled={i === 0} onClick={() => move(i, -1)}>←</Button>
                      <Button type="button" size="sm" variant="ghost" aria-label={`Move image ${i + 1} later`} disabled={i === references.length - 1} onClick={() => move(i, 1)}>→</Button>
                      <Button type="button" size="sm" variant="danger" aria-label={`Remove image ${i + 1}`} onClick={() => remove(r)}>Remove</Button>
                    </div>
                  </>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
