'use client';

import dynamic from 'next/dynamic';
import { useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { Editor, findPanel, findZone, polygonBounds, type TextureInfo, type TextureLookup } from '@/lib/editor';
import type { Panel } from '@/lib/knit/panel';
import type { Yarn } from '@/lib/knit/yarn';
import type { LibraryTexture } from '@/lib/db/textures';
import { summariseBodyMap, type BodyMapSummary } from '@/lib/knit/summary';
import { consumptionBySize, type GarmentConsumption } from '@/lib/knit/consumption';
import type { GarmentKind } from '@/lib/knit/outline';
import { defaultWasteAllowance, gradedSizeStitches, type GradedPoints, type SizeBasis } from '@/lib/knit/yarn-calculator';
import { runRules, type RuleFinding, type StudioRuleLimits } from '@/lib/rules';
import { flatColourForTexture, flatColoursForTextures } from '@/lib/knit/render';
import { useAutosave } from './use-autosave';
import { Toolbar } from './toolbar';
import { RestoreOffer, SaveState } from './save-state';
import { ZonePanel } from './zone-panel';
import { SummaryPanel } from './summary-panel';
import { HelpPanel } from './help-panel';
import type { RulerUnit } from './body-map-canvas';

const BodyMapCanvas = dynamic(() => import('./body-map-canvas'), {
  ssr: false,
  loading: () => <div className="grid h-full place-items-center text-sm text-ink-faint">Loading the canvas…</div>,
});

export type { LibraryTexture };

export interface BodyMapEditorProps {
  styleId: string;
  initial: { version: number; panels: Panel[]; generated: boolean };
  textures: LibraryTexture[];
  yarns: Yarn[];
  machine: { construction: 'seamless' | 'flat'; gauge: number; maxYarns: number };
  /** The studio's float and tuck limits for the rules, with where each comes from. */
  ruleLimits: StudioRuleLimits;
  readOnly: boolean;
  baseSize: string;
  /** The style's sizes, in order, the garment, and the graded size spec (null when none is saved): grams per size. */
  sizes: readonly string[];
  garment: GarmentKind;
  graded: GradedPoints | null;
  /** The style's trims to show over the map, by panel id. */
  trims?: readonly { id: string; panelId: string; box: { x: number; y: number; width: number; height: number }; label: string }[];
}

/** The previous summary per editor, so unchanged panels keep their raster between edits. */
const lastSummary = new WeakMap<Editor, { panels: readonly Panel[]; summary: BodyMapSummary }>();

function textureLookup(textures: readonly LibraryTexture[]): TextureLookup {
  const out: Record<string, TextureInfo> = {};
  for (const t of textures) {
    out[t.id] = {
      repeatNeedles: t.repeat.needles, repeatCourses: t.repeat.courses, walesPerCm: t.density.walesPerCm, coursesPerCm: t.density.coursesPerCm,
      fn: t.function,
    };
  }
  return out;
}

export function BodyMapEditor({ styleId, initial, textures, yarns, machine, ruleLimits, readOnly, baseSize, sizes, garment, graded, trims }: BodyMapEditorProps) {
  const [editor] = useState(
    () =>
      new Editor({
        doc: { version: initial.version, panels: initial.panels },
        textures: textureLookup(textures),
        readOnly,
        drawDefaults: { fn: 'compression', textureId: textures[0]?.id ?? null },
      }),
  );
  const state = useSyncExternalStore(editor.subscribe, editor.getState, editor.getState);
  const { status, reloadLatest, keepCopy, overwrite, backupOffer, restoreBackup, discardBackup } = useAutosave(editor, state, styleId);
  const [fill, setFill] = useState<'texture' | 'flat'>('texture');
  const [rulerUnit, setRulerUnit] = useState<RulerUnit>('stitches');
  const [highlight, setHighlight] = useState<{ panelId: string; needle?: number; course?: number } | null>(null);
  const textureMap = useMemo(() => new Map(textures.map((t) => [t.id, t])), [textures]);
  const colourOf = useMemo(() => {
    const map = flatColoursForTextures(textures.map((t) => t.id));
    return (id: string) => map[id] ?? flatColourForTexture(id);
  }, [textures]);

  // The live summary: rasters of unchanged panels are reused, so a drag recomputes one panel.
  const summary = useMemo(() => {
    const last = lastSummary.get(editor);
    const s = summariseBodyMap({
      panels: state.doc.panels,
      textures: textureMap,
      yarns,
      gauge: machine.gauge,
      previous: last ? { panels: last.panels, rasters: last.summary.rasters } : undefined,
    });
    lastSummary.set(editor, { panels: state.doc.panels, summary: s });
    return s;
  }, [state.doc.panels, textureMap, yarns, machine.gauge, editor]);
  // Grams for the size picked in the summary: the drawn base size, or its stitches graded as the yarn calculator grades them.
  const [size, setSize] = useState(baseSize);
  const sizeGrams = useMemo((): { basis: SizeBasis; consumption: GarmentConsumption | null } => {
    if (size === baseSize || !summary.consumption) return { basis: 'drawn', consumption: summary.consumption };
    const g = gradedSizeStitches({ garment, panels: state.doc.panels, rasters: summary.rasters, baseSize, size, graded });
    if (g.basis !== 'graded' || !g.panels) return { basis: 'base-grams', consumption: summary.consumption };
    return { basis: 'graded', consumption: consumptionBySize({ sizes: [{ size, panels: g.panels }], textures: textureMap, yarns, gauge: machine.gauge, wasteAllowance: defaultWasteAllowance })[size] ?? null };
  }, [size, baseSize, summary, garment, state.doc.panels, graded, textureMap, yarns, machine.gauge]);
  const findings: RuleFinding[] = useMemo(() => {
    try {
      return runRules({ panels: state.doc.panels, textures: textureMap, yarns, machine, limits: ruleLimits.limits, rasters: summary.rasters });
    } catch (err) {
      return [{ rule: 'unknown-texture', severity: 'error', message: err instanceof Error ? err.message : String(err), where: {} } as RuleFinding];
    }
  }, [state.doc.panels, textureMap, yarns, machine, ruleLimits, summary]);

  // Keyboard: shortcuts are data in the editor; off while a text field has focus.
  useEffect(() => {
    const typing = () => {
      const el = document.activeElement as HTMLElement | null;
      return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
    };
    const down = (e: KeyboardEvent) => {
      const used = editor.keyDown({ key: e.key, ctrl: e.ctrlKey, meta: e.metaKey, shift: e.shiftKey, alt: e.altKey, textFieldFocused: typing() });
      if (used) e.preventDefault();
    };
    const up = (e: KeyboardEvent) => { editor.keyUp({ key: e.key }); };
    // Space let go while the window was in the background never sends its keyup.
    const blur = () => editor.holdSpace(false);
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    window.addEventListener('blur', blur);
    return () => { window.removeEventListener('keydown', down); window.removeEventListener('keyup', up); window.removeEventListener('blur', blur); };
  }, [editor]);

  const onFinding = (f: RuleFinding) => {
    if (f.where.zoneId) editor.select([f.where.zoneId]);
    const doc = editor.getState().doc;
    const panel = f.where.panelId ? findPanel(doc, f.where.panelId) : null;
    if (panel) {
      // The finding's stitch, else its zone, else the whole panel.
      const zone = f.where.zoneId ? findZone(doc, f.where.zoneId) : null;
      const place = f.where.needle !== undefined || f.where.course !== undefined
        ? { x: f.where.needle ?? panel.widthNeedles / 2, y: f.where.course ?? panel.heightCourses / 2 }
        : zone ? polygonBounds(zone.zone.polygon) : { minX: 0, minY: 0, maxX: panel.widthNeedles, maxY: panel.heightCourses };
      editor.centreOn(panel.id, place);
    }
    if (f.where.panelId) {
      setHighlight({ panelId: f.where.panelId, needle: f.where.needle, course: f.where.course });
      setTimeout(() => setHighlight(null), 2500);
    }
  };

  return (
    <div className="grid h-[calc(100vh-190px)] min-h-[560px] grid-cols-[1fr_380px] gap-4">
      <div className="flex min-w-0 flex-col overflow-hidden rounded-[var(--radius-card)] border border-rule bg-panel">
        <div className="flex flex-wrap items-center gap-2 border-b border-rule px-3 py-2">
          <Toolbar editor={editor} state={state} fill={fill} onFill={setFill} rulerUnit={rulerUnit} onRulerUnit={setRulerUnit} />
        </div>
        {initial.generated && state.revision === state.savedRevision && state.revision === 0 ? (
          <div className="border-b border-rule bg-spruce-50 px-3 py-1.5 text-xs text-spruce-700">
            Panels generated from the garment type, the machine and the base size ({baseSize}). They are saved with your first edit.
          </div>
        ) : null}
        {state.notice ? <div role="status" className="border-b border-rule bg-ochre-50 px-3 py-1.5 text-xs text-ochre-700">{state.notice}</div> : null}
        <div className="relative min-h-0 flex-1 bg-[#f2f1ec]" tabIndex={0} aria-label="Body map canvas">
          <BodyMapCanvas editor={editor} state={state} textures={textureMap} yarns={yarns} fill={fill} rulerUnit={rulerUnit} highlight={highlight} colourOf={colourOf} trims={trims} />
          {state.helpOpen ? <HelpPanel editor={editor} /> : null}
          <div className="absolute bottom-3 right-3 z-10 max-w-[90%] rounded-md border border-rule bg-panel/95 shadow-sm">
            {backupOffer ? <RestoreOffer savedAt={backupOffer.savedAt} onRestore={restoreBackup} onDiscard={discardBackup} /> : null}
            <SaveState status={status} onReload={reloadLatest} onKeepCopy={keepCopy} onOverwrite={overwrite} />
          </div>
        </div>
      </div>
      <aside className="flex min-h-0 flex-col gap-4 overflow-y-auto pr-1">
        <ZonePanel editor={editor} state={state} textures={textures} summary={summary} colourOf={colourOf} styleId={styleId} />
        <SummaryPanel summary={summary} findings={findings} ruleLimits={ruleLimits} textures={textureMap} yarns={yarns} onFinding={onFinding} baseSize={baseSize} colourOf={colourOf}
          sizes={sizes} size={size} onSize={setSize} sizeGrams={sizeGrams} />
      </aside>
    </div>
  );
}
