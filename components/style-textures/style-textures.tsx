'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import { api, ApiError } from '@/lib/api/client';
import { arealDensity, repeatSizeMm, textureYarnIds } from '@/lib/knit/texture';
import type { LibraryTexture } from '@/lib/db/textures';
import type { LibraryYarn } from '@/lib/db/yarns';
import { textureFamilyLabels } from '@/lib/validations/library';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Select } from '@/components/ui/field';
import { TextureTile } from '@/components/texture/texture-tile';
import { TextureSwatch } from '@/components/texture/texture-swatch';
import { FunctionBadge } from '@/components/library/function-badge';

/** Tiles are drawn at twice true size (a nominal 96 dpi screen shows 37.8 px per cm), all at one scale. */
const TILE_PX_PER_CM = 75.6;
const TILE_W = 120;
const TILE_H = 104;

export interface TextureUse {
  zones: number;
  bases: number;
}

type Status =
  | { kind: 'idle' }
  | { kind: 'saving' }
  | { kind: 'saved' }
  | { kind: 'conflict'; message: string }
  | { kind: 'error'; message: string };

const fmt1 = (v: number) => v.toFixed(1);

function usageText(use: TextureUse | undefined): string {
  if (!use || (use.zones === 0 && use.bases === 0)) return 'Not on the body map';
  const parts = [];
  if (use.zones) parts.push(`${use.zones} ${use.zones === 1 ? 'zone' : 'zones'}`);
  if (use.bases) parts.push(`base of ${use.bases} ${use.bases === 1 ? 'panel' : 'panels'}`);
  return parts.join(' · ');
}

function TextureRow({ texture, yarns, gauge, use, index, count, editable, busy, onMove, onRemove }: {
  texture: LibraryTexture; yarns: readonly LibraryYarn[]; gauge: number; use: TextureUse | undefined; index: number; count: number;
  editable: boolean; busy: boolean; onMove: (delta: -1 | 1) => void; onRemove: () => void;
}) {
  const own = useMemo(() => yarns.filter((y) => textureYarnIds(texture).includes(y.id)), [texture, yarns]);
  const gsm = useMemo(() => {
    try { return arealDensity(texture, own, gauge); } catch { return null; }
  }, [texture, own, gauge]);
  const mm = repeatSizeMm(texture);
  // Whole repeats at least filling the box; the box crops the rest.
  const repeatsX = Math.max(1, Math.ceil(TILE_W / ((texture.repeat.needles / texture.density.walesPerCm) * TILE_PX_PER_CM)));
  const repeatsY = Math.max(1, Math.ceil(TILE_H / ((texture.repeat.courses / texture.density.coursesPerCm) * TILE_PX_PER_CM)));
  const used = !!use && use.zones + use.bases > 0;
  return (
    <li className="grid grid-cols-[120px_minmax(0,1fr)_auto] items-start gap-4 border-b border-rule px-4 py-3 last:border-0" data-testid="style-texture" data-texture-id={texture.id}>
      <div className="h-[104px] w-[120px] overflow-hidden rounded-md border border-rule bg-paper">
        <TextureTile texture={texture} yarns={own} pxPerCm={TILE_PX_PER_CM} repeats={{ x: repeatsX, y: repeatsY }} />
      </div>
      <div className="min-w-0">
        <div className="flex flex-wrap items-center gap-2">
          <span className="figures w-5 text-right text-xs text-ink-faint">{index + 1}</span>
          <h3 className="truncate text-sm font-semibold">{texture.name}</h3>
          <FunctionBadge fn={texture.function} />
          <span className="text-xs text-ink-faint">{textureFamilyLabels[texture.family]}</span>
        </div>
        <dl className="mt-2 grid grid-cols-[repeat(4,minmax(0,max-content))] gap-x-8 gap-y-1 pl-7 text-xs">
          <dt className="text-ink-faint">Density</dt>
          <dt className="text-ink-faint">Est. mass</dt>
          <dt className="text-ink-faint">Repeat</dt>
          <dt className="text-ink-faint">Body map</dt>
          <dd className="figures">{fmt1(texture.density.walesPerCm)} wales × {fmt1(texture.density.coursesPerCm)} courses /cm</dd>
          <dd className="figures">{gsm === null ? '—' : `${gsm.toFixed(0)} g/m²`}</dd>
          <dd className="figures">{texture.repeat.needles} × {texture.repeat.courses} · {mm.widthMm.toFixed(1)} × {mm.heightMm.toFixed(1)} mm</dd>
          <dd className={used ? 'text-ink' : 'text-ink-faint'}>{usageText(use)}</dd>
        </dl>
        <p className="mt-1.5 truncate pl-7 text-xs text-ink-soft">{own.map((y) => y.name).join(' · ')}</p>
      </div>
      {editable ? (
        <div className="flex items-center gap-1">
          <Button size="sm" variant="ghost" aria-label={`Move ${texture.name} up`} disabled={busy || index === 0} onClick={() => onMove(-1)}>↑</Button>
          <Button size="sm" variant="ghost" aria-label={`Move ${texture.name} down`} disabled={busy || index === count - 1} onClick={() => onMove(1)}>↓</Button>
          <Button
            size="sm"
            variant="danger"
            disabled={busy || used}
            title={used ? 'The body map uses this texture: change those zones first' : undefined}
            onClick={onRemove}
          >
            Remove
          </Button>
        </div>
      ) : null}
    </li>
  );
}

/**
 * The textures a style uses: each drawn by the texture renderer at one scale, with density, estimated
 * g/m², repeat and function. Editors add from the studio library, remove and reorder; every change
 * carries the style's version, and a newer save elsewhere is shown instead of overwritten.
 */
export function StyleTextures({ styleId, initial, library, yarns, gauge, usage, editable }: {
  styleId: string;
  initial: { version: number; textures: LibraryTexture[] };
  library: LibraryTexture[];
  yarns: LibraryYarn[];
  gauge: number;
  usage: Record<string, TextureUse>;
  editable: boolean;
}) {
  const [version, setVersion] = useState(initial.version);
  const [textures, setTextures] = useState(initial.textures);
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const [adding, setAdding] = useState('');
  const inStyle = new Set(textures.map((t) => t.id));
  const addable = library.filter((t) => !inStyle.has(t.id) && !t.archivedAt);
  const picked = addable.find((t) => t.id === adding);
  const busy = status.kind === 'saving' || status.kind === 'conflict';

  const save = async (next: LibraryTexture[]) => {
    setStatus({ kind: 'saving' });
    try {
      const res = await api<{ version: number; textures: LibraryTexture[] }>(`/api/styles/${styleId}/textures`, {
        method: 'PUT',
        json: { version, textureIds: next.map((t) => t.id) },
      });
      setVersion(res.version);
      setTextures(res.textures);
      setStatus({ kind: 'saved' });
    } catch (err) {
      if (err instanceof ApiError && err.status === 409 && typeof err.body.currentVersion === 'number') {
        setStatus({ kind: 'conflict', message: err.message });
      } else {
        setStatus({ kind: 'error', message: err instanceof Error ? err.message : 'The change was not saved.' });
      }
    }
  };
  const move = (i: number, delta: -1 | 1) => {
    const next = [...textures];
    const [t] = next.splice(i, 1);
    if (!t) return;
    next.splice(i + delta, 0, t);
    void save(next);
  };

  return (
    <div className="grid grid-cols-[minmax(0,1fr)_300px] gap-4">
      <Card
        title={`Textures of this style · ${textures.length}`}
        actions={
          <span className="text-xs text-ink-faint" data-testid="textures-save-state">
            {!editable ? 'Read only' : status.kind === 'saving' ? 'Saving…' : status.kind === 'saved' ? `Saved · version ${version}` : `Version ${version}`}
          </span>
        }
        className="overflow-hidden [&>div]:p-0"
      >
        {status.kind === 'conflict' ? (
          <div className="border-b border-rule p-3">
            <Notice tone="warn">
              <span className="font-medium">Not saved.</span> {status.message}{' '}
              <button type="button" className="font-medium underline" onClick={() => window.location.reload()}>Reload the latest</button>
            </Notice>
          </div>
        ) : null}
        {status.kind === 'error' ? <div className="border-b border-rule p-3"><Notice tone="error">{status.message}</Notice></div> : null}
        {textures.length === 0 ? (
          <p className="px-4 py-6 text-sm text-ink-soft">No textures yet.{editable ? ' Add them from the studio library.' : ''}</p>
        ) : (
          <ol aria-label="Style textures">
            {textures.map((t, i) => (
              <TextureRow
                key={t.id}
                texture={t}
                yarns={yarns}
                gauge={gauge}
                use={usage[t.id]}
                index={i}
                count={textures.length}
                editable={editable}
                busy={busy}
                onMove={(d) => move(i, d)}
                onRemove={() => void save(textures.filter((x) => x.id !== t.id))}
              />
            ))}
          </ol>
        )}
        <p className="border-t border-rule px-4 py-2 text-xs text-ink-faint">
          Tiles at twice true size, all at one scale. Estimated mass from the loop lengths and counts at {gauge} gauge; a test knit measures it.
        </p>
      </Card>
      <aside className="space-y-4">
        {editable ? (
          <Card title="Add from the library">
            {addable.length === 0 ? (
              <p className="text-sm text-ink-soft">Every library texture is in this style.</p>
            ) : (
              <form
                className="space-y-3"
                onSubmit={(e) => {
                  e.preventDefault();
                  if (!picked) return;
                  setAdding('');
                  void save([...textures, picked]);
                }}
              >
                <label className="block text-xs font-medium text-ink-soft" htmlFor="add-texture">Texture</label>
                <Select id="add-texture" value={adding} onChange={(e) => setAdding(e.target.value)} disabled={busy}>
                  <option value="">Choose a texture…</option>
                  {addable.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
                </Select>
                {picked ? (
                  <div className="flex items-center gap-3 rounded-md border border-rule bg-paper p-2">
                    <TextureSwatch texture={picked} yarns={yarns.filter((y) => textureYarnIds(picked).includes(y.id))} size={48} />
                    <div className="text-xs leading-5">
                      <div className="font-medium text-ink">{textureFamilyLabels[picked.family]}</div>
                      <div className="figures text-ink-soft">{picked.density.walesPerCm} × {picked.density.coursesPerCm} /cm · {picked.repeat.needles} × {picked.repeat.courses}</div>
                    </div>
                  </div>
                ) : null}
                <Button type="submit" variant="primary" disabled={!picked || busy} className="w-full">Add to the style</Button>
              </form>
            )}
          </Card>
        ) : null}
        <Card title="How textures are used">
          <div className="space-y-2 text-xs leading-5 text-ink-soft">
            <p>The body map fills zones and panel bases with these textures; the mill and the client read this list.</p>
            {editable ? (
              <>
                <p>A texture the body map uses cannot be removed here: change its zones in the <Link className="text-spruce-700 underline" href={`/styles/${styleId}/body-map`}>body map</Link> first.</p>
                <p>Charts, feeders and densities are edited in the <Link className="text-spruce-700 underline" href="/library">studio library</Link>.</p>
              </>
            ) : (
              <p>Each tile is the texture’s repeat drawn as loops in its yarns; the mill knits a test piece of every texture.</p>
            )}
          </div>
        </Card>
      </aside>
    </div>
  );
}
