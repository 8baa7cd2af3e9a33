'use client';

import { useEffect, useMemo, useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import type { FitDocument, StudioSeamlessFactor } from '@/lib/db/fit';
import { resolveValues } from '@/lib/fit/grading';
import { compressionBySize, flatNeedles, seamlessNeedles } from '@/lib/fit/fit-sheet';
import { garmentGirths, pointsOfMeasure, type GirthKey, type PointKey } from '@/lib/fit/points';
import type { SizeSpec } from '@/lib/fit/spec';
import { lengthUnits } from '@/lib/fit/units';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { Select } from '@/components/ui/field';
import { SizeSpecCard } from './size-spec-card';
import { GirthsCard } from './girths-card';
import { CutAndSewCard } from './cut-and-sew-card';
import { FitSettingsCard } from './fit-settings-card';
import { NeedlesCard } from './needles-card';
import { CompressionCard } from './compression-card';
import { SampleRoundsCard } from './sample-rounds-card';
import { SummaryCard } from './summary-card';
import {
  applySeamlessEquivalents, changeBaseSize, editCutAndSewCell, editGirthCell, editSpecCell, pasteBlock, regradeAll, type Edit,
} from './spec-edit';
import { useFit, useLengthUnit, useSetFit } from './use-fit';

type SaveState =
  | { kind: 'idle' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  | { kind: 'invalid'; message: string; fields: string[] }
  | { kind: 'conflict'; message: string }
  | { kind: 'error'; message: string };

/** The body of a spec save. */
function saveBody(version: number, spec: SizeSpec) {
  const { baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = spec;
  return { version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target };
}

/**
 * The Fit section: the size spec (graded, editable, in cm or inches), body girths, cut-and-sew
 * entries, the needles and cylinder per size, the compression estimate, and the sample rounds.
 * Spec edits are a draft until saved; a save carries the style's version and a newer save
 * elsewhere is never overwritten without asking.
 */
export function FitWorkspace({ styleId, initial, readOnly }: { styleId: string; initial: FitDocument; readOnly: boolean }) {
  const { data: doc } = useFit(styleId, initial);
  const setFit = useSetFit(styleId);
  const [draft, setDraft] = useState<SizeSpec | null>(null);
  const [unit, setUnit] = useLengthUnit();
  const [editError, setEditError] = useState<string | null>(null);
  const [save, setSave] = useState<SaveState>({ kind: 'idle' });
  const [factorBusy, setFactorBusy] = useState(false);
  const [factorError, setFactorError] = useState<string | null>(null);
  const spec = draft ?? doc.spec;
  const dirty = draft !== null;
  const sizes = doc.sizes;

  // Unsaved spec edits are not lost to a closed tab without a warning.
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => { e.preventDefault(); };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const change = (next: SizeSpec) => {
    setDraft(next);
    if (save.kind === 'saved' || save.kind === 'invalid') setSave({ kind: 'idle' });
  };
  const applyEdit = (res: Edit) => {
    if (res.error) { setEditError(res.error); return; }
    setEditError(null);
    change(res.spec);
  };
  const applyPaste = (res: { spec: SizeSpec; errors: string[]; cells: number }) => {
    setEditError(res.errors.length ? `Pasted ${res.cells} ${res.cells === 1 ? 'cell' : 'cells'}; ${res.errors.length} left as they were: ${res.errors.slice(0, 3).join(' ')}${res.errors.length > 3 ? ' …' : ''}` : null);
    if (res.cells > 0) change(res.spec);
  };

  const runSave = async (version: number) => {
    if (!draft) return;
    setSave({ kind: 'saving' });
    try {
      const { fit } = await api<{ fit: FitDocument }>(`/api/styles/${styleId}/fit`, { method: 'PUT', json: saveBody(version, draft) });
      setFit(fit);
      setDraft(null);
      setSave({ kind: 'saved', at: new Date() });
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) setSave({ kind: 'conflict', message: err.message });
      else if (err instanceof ApiError && err.status === 400) {
        setSave({ kind: 'invalid', message: err.message, fields: Object.entries(err.fieldErrors).map(([k, v]) => `${k}: ${v[0]}`) });
      } else setSave({ kind: 'error', message: err instanceof Error ? err.message : 'The spec was not saved.' });
    }
  };
  const latest = async () => {
    const { fit } = await api<{ fit: FitDocument }>(`/api/styles/${styleId}/fit`);
    setFit(fit);
    return fit;
  };

  const saveFactor = async (factor: number) => {
    setFactorBusy(true);
    setFactorError(null);
    try {
      const expected = doc.studioFactor.isDefault ? null : doc.studioFactor.factor;
      const { studioFactor } = await api<{ studioFactor: StudioSeamlessFactor }>(`/api/styles/${styleId}/fit/equivalence`, {
        method: 'PUT', json: { factor, expected },
      });
      setFit({ ...doc, studioFactor });
    } catch (err) {
      setFactorError(err instanceof Error ? err.message : 'The factor was not saved.');
      if (err instanceof ApiError && err.status === 409) await latest();
    } finally {
      setFactorBusy(false);
    }
  };

  // Everything computed live from the spec on screen (saved or draft).
  const computed = useMemo(() => {
    const values = resolveValues(spec.points, sizes, spec.baseSize);
    const base = doc.textures.find((t) => t.id === spec.baseTextureId) ?? doc.textures[0] ?? null;
    const compression = doc.textures.find((t) => t.id === spec.compressionTextureId && t.forceExtension) ?? null;
    const density = base ? { walesPerCm: base.walesPerCm, coursesPerCm: base.coursesPerCm } : null;
    const m = doc.machine;
    const seamless = density && m.kind === 'circular'
      ? seamlessNeedles({ garment: doc.garmentType, machine: m, sizes, values, density, cylinderDiametersIn: spec.cylinderDiametersIn })
      : null;
    const flat = density && m.kind === 'flat' ? flatNeedles({ garment: doc.garmentType, machine: m, sizes, values, density }) : null;
    const pressure = compression?.forceExtension
      ? compressionBySize({ garment: doc.garmentType, sizes, values, girths: spec.girths, curve: compression.forceExtension, target: spec.target })
      : null;
    const tolerances = Object.fromEntries(spec.points.map((p) => [p.point, p.toleranceCm]));
    return { base, compression, seamless, flat, pressure, tolerances };
  }, [spec, sizes, doc.textures, doc.machine, doc.garmentType]);

  const girthKeys: readonly GirthKey[] = garmentGirths[doc.garmentType];
  const halfWidthPoints: PointKey[] = spec.points.map((p) => p.point).filter((p) => pointsOfMeasure[p].kind === 'half-width');
  const overrides = spec.points.reduce((n, p) => n + Object.keys(p.overrides).filter((s) => sizes.includes(s) && s !== spec.baseSize).length, 0);
  const findings = computed.pressure?.reduce((n, r) => n + r.girths.filter((g) => g.finding).length, 0) ?? 0;

  return (
    <div className="space-y-4" data-testid="fit-workspace">
      <div className="sticky top-12 z-20 -mx-1 flex flex-wrap items-center gap-3 rounded-md border border-rule bg-panel/95 px-3 py-2 shadow-sm backdrop-blur">
        <label className="flex items-center gap-2 text-xs font-medium text-ink-soft">
          Base size
          <Select
            aria-label="Base size"
            className="h-8 w-20"
            disabled={readOnly}
            value={spec.baseSize}
            onChange={(e) => change(changeBaseSize(spec, sizes, e.target.value))}
          >
            {sizes.map((s) => <option key={s} value={s}>{s}</option>)}
          </Select>
        </label>
        <div role="radiogroup" aria-label="Units" className="inline-flex overflow-hidden rounded-md border border-rule-strong text-xs">
          {lengthUnits.map((u) => (
            <button
              key={u}
              type="button"
              role="radio"
              aria-checked={unit === u}
              onClick={() => setUnit(u)}
              className={`px-2.5 py-1.5 font-medium ${unit === u ? 'bg-ink text-white' : 'bg-panel text-ink-soft hover:bg-paper'}`}
            >
              {u}
            </button>
          ))}
        </div>
        {readOnly ? null : (
          <Button
            size="sm"
            variant="secondary"
            disabled={overrides === 0}
            title={overrides ? `Drops ${overrides} hand-set values` : 'Every size already grades from the base'}
            onClick={() => { if (window.confirm(`Grade every size from ${spec.baseSize} again? ${overrides} hand-set values will be dropped.`)) change(regradeAll(spec)); }}
          >
            Re-grade all from {spec.baseSize}
          </Button>
        )}
        <div className="figures hidden text-xs text-ink-faint md:block">
          {spec.points.filter((p) => p.baseCm !== null).length}/{spec.points.length} points · {overrides} set by hand · {findings} compression {findings === 1 ? 'finding' : 'findings'}
        </div>
        <div className="ml-auto flex items-center gap-2">
          <SaveIndicator state={save} dirty={dirty} readOnly={readOnly} savedBy={doc.updatedBy} />
          {readOnly ? null : (
            <>
              <Button size="sm" variant="ghost" disabled={!dirty || save.kind === 'saving'} onClick={() => { setDraft(null); setEditError(null); setSave({ kind: 'idle' }); }}>Discard</Button>
              <Button size="sm" variant="primary" disabled={!dirty || save.kind === 'saving'} onClick={() => runSave(doc.version)}>
                {save.kind === 'saving' ? 'Saving…' : 'Save spec'}
              </Button>
            </>
          )}
        </div>
      </div>

      {save.kind === 'conflict' ? (
        <Notice tone="error">
          {save.message}{' '}
          <span className="ml-2 inline-flex gap-2">
            <Button size="sm" variant="secondary" onClick={async () => { await latest(); setDraft(null); setSave({ kind: 'idle' }); }}>Load theirs (drop my edits)</Button>
            <Button
              size="sm"
              variant="danger"
              onClick={async () => {
                if (!window.confirm('Save your spec over the newer one? Their changes to the spec will be replaced by yours.')) return;
                const fit = await latest();
                await runSave(fit.version);
              }}
            >
              Save mine over theirs
            </Button>
          </span>
        </Notice>
      ) : null}
      {save.kind === 'invalid' ? <Notice tone="error">{save.message} {save.fields.join('; ')}</Notice> : null}
      {save.kind === 'error' ? <Notice tone="error">Not saved: {save.message} Your edits are still here; try again.</Notice> : null}
      {editError ? <Notice tone="warn">{editError}</Notice> : null}

      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,1fr)_300px]">
        <div className="min-w-0 space-y-4">
          <SizeSpecCard
            spec={spec}
            sizes={sizes}
            unit={unit}
            readOnly={readOnly}
            onCommit={(row, colId, raw) => applyEdit(editSpecCell(spec, sizes, unit, row as PointKey, colId, raw))}
            onPaste={(row, colId, grid, colIds, rowIds) =>
              applyPaste(pasteBlock(spec, grid, { rowId: row, colId }, rowIds, colIds, (s, r, c, raw) => editSpecCell(s, sizes, unit, r as PointKey, c, raw)))}
            onClearRow={(point) => change({ ...spec, points: spec.points.map((p) => (p.point === point ? { ...p, overrides: {} } : p)) })}
          />
          <div className={`grid grid-cols-1 gap-4 ${doc.construction === 'seamless' ? '2xl:grid-cols-2' : ''}`}>
            <GirthsCard
              spec={spec}
              sizes={sizes}
              girths={girthKeys}
              unit={unit}
              readOnly={readOnly}
              onCommit={(row, colId, raw) => applyEdit(editGirthCell(spec, unit, row as GirthKey, colId, raw))}
              onPaste={(row, colId, grid, colIds, rowIds) =>
                applyPaste(pasteBlock(spec, grid, { rowId: row, colId }, rowIds, colIds, (s, r, c, raw) => editGirthCell(s, unit, r as GirthKey, c, raw)))}
            />
            {doc.construction === 'seamless' ? <CutAndSewCard
              spec={spec}
              sizes={sizes}
              points={halfWidthPoints}
              unit={unit}
              readOnly={readOnly}
              factor={doc.studioFactor}
              onCommit={(row, colId, raw) => applyEdit(editCutAndSewCell(spec, unit, row, colId, raw))}
              onPaste={(row, colId, grid, colIds, rowIds) =>
                applyPaste(pasteBlock(spec, grid, { rowId: row, colId }, rowIds.filter((r) => r.startsWith('cs:')), colIds, (s, r, c, raw) => editCutAndSewCell(s, unit, r, c, raw)))}
              onUseEquivalents={() => change(applySeamlessEquivalents(spec, sizes, doc.studioFactor.factor))}
              onSaveFactor={saveFactor}
              factorBusy={factorBusy}
              factorError={factorError}
            /> : null}
          </div>
          <NeedlesCard
            machine={doc.machine}
            base={computed.base}
            textures={doc.textures}
            seamless={computed.seamless}
            flat={computed.flat}
            unit={unit}
            tolerances={computed.tolerances}
          />
          <CompressionCard rows={computed.pressure} target={spec.target} texture={computed.compression} unit={unit} />
          <SampleRoundsCard
            doc={doc}
            spec={spec}
            unit={unit}
            readOnly={readOnly}
            blocked={dirty ? 'The spec has unsaved changes: save or discard them before recording or editing rounds and deciding corrections (photos and comments can go on).' : null}
            onDoc={setFit}
          />
        </div>
        <aside className="space-y-4 xl:sticky xl:top-28 xl:self-start">
          <SummaryCard sizes={sizes} seamless={computed.seamless} flat={computed.flat} pressure={computed.pressure} />
          <FitSettingsCard spec={spec} textures={doc.textures} readOnly={readOnly} construction={doc.construction} onChange={change} />
        </aside>
      </div>
    </div>
  );
}

function SaveIndicator({ state, dirty, readOnly, savedBy }: { state: SaveState; dirty: boolean; readOnly: boolean; savedBy: string | null }) {
  const base = 'text-xs font-medium';
  if (readOnly) return <span data-testid="fit-save-state" data-state="read-only" className={`${base} rounded bg-rule/60 px-2 py-1 text-ink-soft`}>Read only</span>;
  if (state.kind === 'saving') return <span data-testid="fit-save-state" data-state="saving" className={`${base} text-ink-soft`}>Saving…</span>;
  if (dirty) return <span data-testid="fit-save-state" data-state="unsaved" className={`${base} text-ochre-700`}>● Unsaved changes</span>;
  if (state.kind === 'saved') {
    return <span data-testid="fit-save-state" data-state="saved" className={`${base} text-spruce-700`}>● Saved {state.at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}</span>;
  }
  return <span data-testid="fit-save-state" data-state="saved" className={`${base} text-ink-faint`}>{savedBy ? `Saved · last by ${savedBy}` : 'Nothing saved yet'}</span>;
}
