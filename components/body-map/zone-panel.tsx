'use client';

import { useState } from 'react';
import { zonesInDrawOrder, type Editor, type EditorState } from '@/lib/editor';
import { zoneFunctionLabels, zoneFunctions, type Zone, type ZoneFunction } from '@/lib/knit/panel';
import type { BodyMapSummary } from '@/lib/knit/summary';
import type { LibraryTexture } from './body-map-editor';
import type { Panel } from '@/lib/knit/panel';
import { api, ApiError } from '@/lib/api/client';

const fmt = new Intl.NumberFormat('en-GB');

export function ZonePanel({ editor, state, textures, summary, colourOf, styleId }: { editor: Editor; state: EditorState; textures: LibraryTexture[]; summary: BodyMapSummary; colourOf: (id: string) => string; styleId: string }) {
  const selected = state.selection.zoneIds;
  const ro = state.readOnly;
  const textureName = (id: string) => textures.find((t) => t.id === id)?.name ?? 'Unknown texture';
  let selectedZone: Zone | null = null;
  for (const p of state.doc.panels) for (const z of p.zones) if (selected.length === 1 && z.id === selected[0]) selectedZone = z;

  return (
    <section className="rounded-[var(--radius-card)] border border-rule bg-panel" aria-label="Zones">
      <header className="flex items-center justify-between border-b border-rule px-3 py-2">
        <h2 className="text-[13px] font-semibold">Zones</h2>
        <span className="text-xs text-ink-faint">{ro ? 'Read only' : 'Draw with D; click to select'}</span>
      </header>
      <div className="max-h-[300px] overflow-y-auto">
        {state.doc.panels.map((panel) => {
          const zones = [...zonesInDrawOrder(panel)].reverse();
          const raster = summary.rasters.get(panel.id);
          return (
            <div key={panel.id} className="border-b border-rule/70 last:border-0">
              <div className="flex flex-wrap items-center justify-between gap-x-2 gap-y-1 bg-paper/60 px-3 py-1 text-xs font-medium text-ink-soft">
                <span>{panel.name}</span>
                <span className="ml-auto figures text-ink-faint">{raster ? `${fmt.format(raster.inside)} st. kept` : ''}</span>
                {!ro ? <OutlineUpload editor={editor} panel={panel} styleId={styleId} /> : null}
              </div>
              {zones.length === 0 ? <div className="px-3 py-1.5 text-xs text-ink-faint">Base texture only: {textureName(panel.baseTextureId)}</div> : null}
              <ul>
                {zones.map((z, i) => {
                  const isSel = selected.includes(z.id);
                  const count = raster?.zoneStitches.find((c) => c.zoneId === z.id);
                  return (
                    <li key={z.id} className={`flex items-center gap-2 px-3 py-1.5 text-sm ${isSel ? 'bg-spruce-50' : 'hover:bg-paper'}`}>
                      <span className="h-3 w-3 shrink-0 rounded-sm ring-1 ring-ink/20" style={{ background: colourOf(z.textureId) }} aria-hidden />
                      <button type="button" className="min-w-0 flex-1 truncate text-left" onClick={(e) => editor.select([z.id], { additive: e.shiftKey })} aria-pressed={isSel}>
                        <span className="font-medium">{z.name}</span>
                        <span className="ml-1.5 text-xs text-ink-faint">{zoneFunctionLabels[z.fn]} · {textureName(z.textureId)}</span>
                      </button>
                      <span className="figures text-xs text-ink-faint">{count ? fmt.format(count.inside + count.outside) : ''}</span>
                      {!ro ? (
                        <span className="flex">
                          <button type="button" aria-label={`Bring ${z.name} forward`} disabled={i === 0} className="px-1 text-ink-faint hover:text-ink disabled:opacity-30" onClick={() => editor.reorder('forward', [z.id])}>▲</button>
                          <button type="button" aria-label={`Send ${z.name} backward`} disabled={i === zones.length - 1} className="px-1 text-ink-faint hover:text-ink disabled:opacity-30" onClick={() => editor.reorder('backward', [z.id])}>▼</button>
                        </span>
                      ) : null}
                    </li>
                  );
                })}
              </ul>
            </div>
          );
        })}
      </div>
      {selectedZone ? <ZoneInspector key={`${selectedZone.id}:${selectedZone.name}`} zone={selectedZone} editor={editor} textures={textures} readOnly={ro} /> : null}
      {!selectedZone && !ro ? (
        <div className="border-t border-rule px-3 py-2 text-xs text-ink-soft">
          <label className="flex items-center gap-2">
            New zones use
            <select
              aria-label="Texture for new zones"
              className="h-7 flex-1 rounded border border-rule bg-panel px-1 text-xs"
              value={state.drawDefaults.textureId ?? ''}
              onChange={(e) => editor.setDrawDefaults({ textureId: e.target.value || null })}
            >
              {textures.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
            </select>
          </label>
        </div>
      ) : null}
    </section>
  );
}

function ZoneInspector({ zone, editor, textures, readOnly }: { zone: Zone; editor: Editor; textures: LibraryTexture[]; readOnly: boolean }) {
  const [name, setName] = useState(zone.name);
  const commit = () => { if (name.trim() && name !== zone.name) editor.renameZone(zone.id, name.trim()); };
  return (
    <div className="space-y-2 border-t border-rule px-3 py-3" aria-label="Selected zone">
      <div className="grid grid-cols-[72px_1fr] items-center gap-x-2 gap-y-2 text-xs">
        <label htmlFor="zone-name" className="text-ink-soft">Name</label>
        <input id="zone-name" disabled={readOnly} className="h-8 rounded border border-rule-strong bg-panel px-2 text-sm" value={name} onChange={(e) => setName(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') { commit(); (e.target as HTMLInputElement).blur(); } }} />
        <label htmlFor="zone-texture" className="text-ink-soft">Texture</label>
        <select id="zone-texture" disabled={readOnly} className="h-8 rounded border border-rule-strong bg-panel px-1.5 text-sm" value={zone.textureId} onChange={(e) => editor.setZoneTexture(e.target.value, [zone.id])}>
          {textures.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
        </select>
        <label htmlFor="zone-fn" className="text-ink-soft">Function</label>
        <select id="zone-fn" disabled={readOnly} className="h-8 rounded border border-rule-strong bg-panel px-1.5 text-sm" value={zone.fn} onChange={(e) => editor.setZoneFunction(e.target.value as ZoneFunction, [zone.id])}>
          {zoneFunctions.map((f) => <option key={f} value={f}>{zoneFunctionLabels[f]}</option>)}
        </select>
      </div>
      {!readOnly ? (
        <div className="flex flex-wrap gap-1.5 pt-1">
          <button type="button" className="rounded border border-rule px-2 py-1 text-xs hover:bg-paper" onClick={() => editor.mirror('copy', [zone.id])}>Mirrored copy</button>
          <button type="button" className="rounded border border-rule px-2 py-1 text-xs hover:bg-paper" onClick={() => editor.mirror('in-place', [zone.id])}>Mirror in place</button>
          <button type="button" className="rounded border border-rule px-2 py-1 text-xs hover:bg-paper" onClick={() => editor.copyToOtherPanel([zone.id])}>Copy to other panel</button>
          <button type="button" className="rounded border border-rule px-2 py-1 text-xs hover:bg-paper" onClick={() => editor.snapToRepeats([zone.id])}>Whole repeats</button>
          <button type="button" className="rounded border border-madder-500/40 px-2 py-1 text-xs text-madder-700 hover:bg-madder-50" onClick={() => editor.deleteZones([zone.id])}>Delete</button>
        </div>
      ) : null}
    </div>
  );
}

/** Replaces a panel's cut lines with the outline of an SVG drawing (only its path geometry is used). */
function OutlineUpload({ editor, panel, styleId }: { editor: Editor; panel: Panel; styleId: string }) {
  const [error, setError] = useState<string | null>(null);
  return (
    <>
    <label className="cursor-pointer rounded border border-rule bg-panel px-1.5 py-0.5 font-normal text-ink-soft hover:text-ink" title="Replace the cut lines with the outline of an SVG drawing">
      {error ? <span className="text-madder-700">Outline refused</span> : 'Outline from SVG…'}
      <input
        type="file"
        accept=".svg,image/svg+xml"
        className="sr-only"
        aria-label={`Upload an SVG outline for ${panel.name}`}
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (!file) return;
          setError(null);
          if (file.size > 1_000_000) { setError('The drawing is larger than 1 MB.'); return; }
          try {
            const { polygon } = await api<{ polygon: Panel['cutOutline'] }>(`/api/styles/${styleId}/body-map/outline`, {
              method: 'POST',
              json: { svg: await file.text(), widthNeedles: panel.widthNeedles, heightCourses: panel.heightCourses },
            });
            editor.replaceOutline(panel.id, polygon);
          } catch (err) {
            setError(err instanceof ApiError ? err.message : 'The outline could not be read.');
          }
        }}
      />
    </label>
    {/* On a line of its own under the panel's name, read out when it appears. */}
    {error ? <p role="alert" className="basis-full font-normal text-madder-700">{panel.name}: {error}</p> : null}
    </>
  );
}
