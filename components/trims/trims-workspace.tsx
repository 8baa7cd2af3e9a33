'use client';

import dynamic from 'next/dynamic';
import { useMemo, useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import type { LibraryTexture } from '@/lib/db/textures';
import type { LibraryYarn } from '@/lib/db/yarns';
import type { StyleTrim } from '@/lib/db/trims';
import { panelDensity, type TextureLookup } from '@/lib/editor';
import { fibres, type FibreId } from '@/lib/knit/fibres';
import { panelKinds, type Panel, type PanelKind, type StitchPoint } from '@/lib/knit/panel';
import { rasterizePanel, type PanelRaster } from '@/lib/knit/raster';
import { flatColourForTexture, flatColoursForTextures } from '@/lib/knit/render';
import { textureYarnIds } from '@/lib/knit/texture';
import { runRules, texturesUnderBox, type RuleFinding, type RuleMachine } from '@/lib/rules';
import { trimKinds, trimMethods, type StitchBox, type Trim, type TrimKind, type TrimMethod } from '@/lib/rules/trim';
import { trimKindLabels, trimMethodLabels } from '@/lib/validations/library';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import type { CanvasTrim } from './trim-canvas';

const TrimCanvas = dynamic(() => import('./trim-canvas'), {
  ssr: false,
  loading: () => <div className="grid h-full place-items-center text-sm text-ink-faint">Loading the panels…</div>,
});

/** The rules this section shows: the trims' own. */
const trimRules = new Set<RuleFinding['rule']>(['trim-heat', 'trim-reheat', 'trim-ventilation', 'knitted-logo-detail']);

/** Methods that go with a kind: a knitted logo is knitted in, and nothing else is. */
const methodsFor = (kind: TrimKind): TrimMethod[] => (kind === 'knitted-logo' ? ['knitted'] : trimMethods.filter((m) => m !== 'knitted'));
const defaultMethod: Record<TrimKind, TrimMethod> = {
  'heat-transfer': 'heat-press', 'woven-label': 'sewn', 'printed-tag': 'printed', 'care-label': 'sewn', 'knitted-logo': 'knitted',
};
const heatMethod = (m: TrimMethod) => m === 'heat-press' || m === 'bonded';

interface Draft {
  id: string | null;
  version: number | null;
  name: string;
  kind: TrimKind;
  method: TrimMethod;
  tempC: string;
  detailMm: string;
  panelKind: PanelKind;
  widthMm: string;
  heightMm: string;
  x: number;
  y: number;
}

type Status = { kind: 'idle' } | { kind: 'saving' } | { kind: 'conflict'; message: string } | { kind: 'error'; message: string; fields: Record<string, string[]> };

const numOrNull = (s: string) => (s.trim() === '' ? null : Number(s.replace(',', '.')));
const mm1 = (v: number) => Number(v.toFixed(1)).toString();

/** The drafted trim's box in stitches: its size in mm at the panel's base density, at its place. */
function boxOfDraft(d: Draft, panelByKind: ReadonlyMap<PanelKind, Panel>, lookup: TextureLookup): StitchBox | null {
  const p = panelByKind.get(d.panelKind);
  const w = numOrNull(d.widthMm);
  const h = numOrNull(d.heightMm);
  if (!p || w === null || h === null || !(w > 0) || !(h > 0)) return null;
  const density = panelDensity(p, lookup);
  return { x: d.x, y: d.y, width: Math.max(1, Math.round((w / 10) * density.walesPerCm)), height: Math.max(1, Math.round((h / 10) * density.coursesPerCm)) };
}

function textureLookup(textures: readonly LibraryTexture[]): TextureLookup {
  const out: Record<string, { repeatNeedles: number; repeatCourses: number; walesPerCm: number; coursesPerCm: number }> = {};
  for (const t of textures) out[t.id] = { repeatNeedles: t.repeat.needles, repeatCourses: t.repeat.courses, walesPerCm: t.density.walesPerCm, coursesPerCm: t.density.coursesPerCm };
  return out;
}

/**
 * The Trims section: the style's trims listed and placed on its panels. Editors add, edit, move
 * (drag, or click a panel to place) and delete them; every write carries the trim's version. The
 * rule findings (heat over fibres that cannot take it, a second heat application, a trim over a
 * ventilation zone, a knitted logo finer than a stitch) are computed live, before saving.
 */
export function TrimsWorkspace({ styleId, panels, generated, textures, yarns, colourIds, machine, initialTrims, editable }: {
  styleId: string; panels: Panel[]; generated: boolean; textures: LibraryTexture[]; yarns: LibraryYarn[]; colourIds: string[];
  machine: RuleMachine; initialTrims: StyleTrim[]; editable: boolean;
}) {
  const [trims, setTrims] = useState(initialTrims);
  const [selectedId, setSelectedId] = useState<string | null>(initialTrims[0]?.id ?? null);
  const [draft, setDraft] = useState<Draft | null>(null);
  const [placing, setPlacing] = useState(false);
  const [status, setStatus] = useState<Status>({ kind: 'idle' });

  const lookup = useMemo(() => textureLookup(textures), [textures]);
  const textureMap = useMemo(() => new Map(textures.map((t) => [t.id, t])), [textures]);
  const colourOf = useMemo(() => {
    const map = flatColoursForTextures(colourIds);
    return (id: string) => map[id] ?? flatColourForTexture(id);
  }, [colourIds]);
  const panelByKind = useMemo(() => new Map(panels.map((p) => [p.kind, p])), [panels]);
  const rasters = useMemo(() => new Map<string, PanelRaster>(panels.map((p) => [p.id, rasterizePanel(p, { zoneMap: true, counts: false })])), [panels]);

  const densityOf = (kind: PanelKind) => {
    const p = panelByKind.get(kind);
    return p ? panelDensity(p, lookup) : null;
  };
  const toMm = (kind: PanelKind, box: StitchBox) => {
    const d = densityOf(kind);
    return d ? { widthMm: (box.width / d.walesPerCm) * 10, heightMm: (box.height / d.coursesPerCm) * 10 } : null;
  };
  const draftBox = (d: Draft) => boxOfDraft(d, panelByKind, lookup);

  // The trims as the rules see them: saved ones, with the one being edited as drafted.
  const ruleTrims: Trim[] = useMemo(() => {
    const out: Trim[] = [];
    const asRule = (id: string, name: string, kind: TrimKind, method: TrimMethod, panelKind: PanelKind, box: StitchBox, tempC: number | null, detailMm: number | null) => {
      const panel = panelByKind.get(panelKind);
      if (!panel) return;
      const t: Trim = { id, name, panelId: panel.id, kind, method, box };
      if (tempC !== null && Number.isFinite(tempC)) t.tempC = tempC;
      if (detailMm !== null && Number.isFinite(detailMm)) t.detailMm = detailMm;
      out.push(t);
    };
    for (const t of trims) {
      if (draft && draft.id === t.id) continue;
      asRule(t.id, t.name, t.kind, t.method, t.panelKind, t.box, t.tempC, t.detailMm);
    }
    if (draft) {
      const box = boxOfDraft(draft, panelByKind, lookup);
      if (box) asRule(draft.id ?? 'new', draft.name || 'New trim', draft.kind, draft.method, draft.panelKind, box, numOrNull(draft.tempC), numOrNull(draft.detailMm));
    }
    return out;
  }, [trims, draft, panelByKind, lookup]);

  const findings = useMemo(() => {
    try {
      return runRules({ panels, textures: textureMap, yarns, machine, trims: ruleTrims, rasters }).filter((f) => trimRules.has(f.rule));
    } catch (err) {
      return [{ rule: 'trim-heat', severity: 'error', message: err instanceof Error ? err.message : String(err), where: {} } as RuleFinding];
    }
  }, [panels, textureMap, yarns, machine, ruleTrims, rasters]);
  const toneOf = (id: string): CanvasTrim['tone'] => {
    const fs = findings.filter((f) => f.where.trimIds?.includes(id));
    return fs.some((f) => f.severity === 'error') ? 'error' : fs.some((f) => f.severity === 'warning') ? 'warning' : fs.length ? 'info' : null;
  };

  const activeId = draft ? (draft.id ?? 'new') : selectedId;
  const canvasTrims: CanvasTrim[] = ruleTrims.map((t) => ({
    id: t.id, panelId: t.panelId, box: t.box, label: t.name ?? '', tone: toneOf(t.id), selected: t.id === activeId, draft: t.id === 'new',
  }));

  const startEdit = (t: StyleTrim) => {
    const mm = toMm(t.panelKind, t.box);
    setDraft({
      id: t.id, version: t.version, name: t.name, kind: t.kind, method: t.method, tempC: t.tempC === null ? '' : String(t.tempC),
      detailMm: t.detailMm === null ? '' : String(t.detailMm), panelKind: t.panelKind,
      widthMm: mm ? mm1(mm.widthMm) : '', heightMm: mm ? mm1(mm.heightMm) : '', x: t.box.x, y: t.box.y,
    });
    setSelectedId(t.id);
    setPlacing(false);
    setStatus({ kind: 'idle' });
  };
  const startNew = () => {
    const panel = panelByKind.get('front') ?? panels[0];
    if (!panel) return;
    const d = panelDensity(panel, lookup);
    const w = Math.round(6 * d.walesPerCm);
    const h = Math.round(4 * d.coursesPerCm);
    setDraft({
      id: null, version: null, name: '', kind: 'heat-transfer', method: 'heat-press', tempC: '150', detailMm: '', panelKind: panel.kind,
      widthMm: '60', heightMm: '40', x: Math.round(panel.widthNeedles / 2 - w / 2), y: Math.round(panel.heightCourses * 0.15 - h / 2),
    });
    setSelectedId(null);
    setPlacing(true);
    setStatus({ kind: 'idle' });
  };
  const close = () => { setDraft(null); setPlacing(false); setStatus({ kind: 'idle' }); };

  const fail = (err: unknown) => {
    if (err instanceof ApiError && err.status === 409) setStatus({ kind: 'conflict', message: err.message });
    else if (err instanceof ApiError) setStatus({ kind: 'error', message: err.message, fields: err.fieldErrors });
    else setStatus({ kind: 'error', message: 'The change was not saved.', fields: {} });
  };

  const save = async () => {
    if (!draft) return;
    const box = draftBox(draft);
    const density = densityOf(draft.panelKind);
    if (!box || !density) {
      setStatus({ kind: 'error', message: 'Some fields need attention.', fields: { size: ['Enter the width and height in mm'] } });
      return;
    }
    const panel = panelByKind.get(draft.panelKind)!;
    const clamped = { ...box, x: Math.min(Math.max(0, box.x), Math.max(0, panel.widthNeedles - box.width)), y: Math.min(Math.max(0, box.y), Math.max(0, panel.heightCourses - box.height)) };
    const body = {
      panelKind: draft.panelKind, name: draft.name, kind: draft.kind, method: draft.method,
      tempC: heatMethod(draft.method) ? draft.tempC : null,
      detailMm: draft.kind === 'knitted-logo' ? draft.detailMm : null,
      box: clamped,
    };
    setStatus({ kind: 'saving' });
    try {
      if (draft.id === null) {
        const res = await api<{ trim: StyleTrim }>(`/api/styles/${styleId}/trims`, { method: 'POST', json: body });
        setTrims((ts) => [...ts, res.trim]);
        setSelectedId(res.trim.id);
      } else {
        const res = await api<{ trim: StyleTrim }>(`/api/styles/${styleId}/trims/${draft.id}`, { method: 'PATCH', json: { ...body, version: draft.version } });
        setTrims((ts) => ts.map((t) => (t.id === res.trim.id ? res.trim : t)));
        setSelectedId(res.trim.id);
      }
      setDraft(null);
      setPlacing(false);
      setStatus({ kind: 'idle' });
    } catch (err) {
      fail(err);
    }
  };

  const remove = async (t: StyleTrim) => {
    if (!window.confirm(`Delete ${t.name || trimKindLabels[t.kind].toLowerCase()}?`)) return;
    setStatus({ kind: 'saving' });
    try {
      await api(`/api/styles/${styleId}/trims/${t.id}?version=${t.version}`, { method: 'DELETE' });
      setTrims((ts) => ts.filter((x) => x.id !== t.id));
      if (draft?.id === t.id) setDraft(null);
      if (selectedId === t.id) setSelectedId(null);
      setStatus({ kind: 'idle' });
    } catch (err) {
      fail(err);
    }
  };

  /**
   * A drag on the canvas. A trim not added yet only moves; a saved one is saved at its new place at
   * once (its stored size: size edits in the form wait for "Save trim"), and the form follows.
   */
  const move = async (id: string, to: StitchBox) => {
    if (id === 'new') {
      if (draft) setDraft({ ...draft, x: to.x, y: to.y });
      return;
    }
    const t = trims.find((x) => x.id === id);
    if (!t || !editable) return;
    const box = { ...t.box, x: to.x, y: to.y };
    setTrims((ts) => ts.map((x) => (x.id === id ? { ...x, box } : x)));
    if (draft?.id === id) setDraft({ ...draft, x: to.x, y: to.y });
    setStatus({ kind: 'saving' });
    try {
      const res = await api<{ trim: StyleTrim }>(`/api/styles/${styleId}/trims/${id}`, { method: 'PATCH', json: { version: t.version, box } });
      setTrims((ts) => ts.map((x) => (x.id === id ? res.trim : x)));
      setDraft((d) => (d && d.id === id ? { ...d, version: res.trim.version } : d));
      setStatus({ kind: 'idle' });
    } catch (err) {
      setTrims((ts) => ts.map((x) => (x.id === id ? t : x)));
      setDraft((d) => (d && d.id === id ? { ...d, x: t.box.x, y: t.box.y } : d));
      fail(err);
    }
  };

  const place = (panelId: string, at: StitchPoint) => {
    if (!draft) return;
    const panel = panels.find((p) => p.id === panelId);
    if (!panel) return;
    const next = { ...draft, panelKind: panel.kind };
    const box = draftBox(next) ?? { x: 0, y: 0, width: 1, height: 1 };
    setDraft({
      ...next,
      x: Math.min(Math.max(0, Math.round(at.x - box.width / 2)), Math.max(0, panel.widthNeedles - box.width)),
      y: Math.min(Math.max(0, Math.round(at.y - box.height / 2)), Math.max(0, panel.heightCourses - box.height)),
    });
    setPlacing(false);
  };

  const selected = draft ? null : trims.find((t) => t.id === selectedId) ?? null;
  const fieldErr = (k: string) => (status.kind === 'error' ? status.fields[k]?.[0] : undefined);
  const busy = status.kind === 'saving';

  // What the fabric under the drafted trim can take, for the temperature field.
  const underDraft = useMemo(() => {
    if (!draft) return [];
    const box = boxOfDraft(draft, panelByKind, lookup);
    const panel = panelByKind.get(draft.panelKind);
    const raster = panel ? rasters.get(panel.id) : undefined;
    if (!box || !raster) return [];
    const limits = new Map<FibreId, number>();
    const names: string[] = [];
    for (const id of texturesUnderBox(raster, box)) {
      const t = textureMap.get(id);
      if (!t) continue;
      names.push(t.name);
      for (const yid of textureYarnIds(t)) {
        for (const f of yarns.find((y) => y.id === yid)?.fibres ?? []) {
          const lim = fibres[f.fibre].heatLimitC;
          if (lim !== undefined) limits.set(f.fibre, lim);
        }
      }
    }
    return [{ names, limits: [...limits.entries()].sort((a, b) => a[1] - b[1]) }];
  }, [draft, panelByKind, rasters, textureMap, yarns, lookup]);

  return (
    <div className="grid grid-cols-[minmax(0,1fr)_380px] items-start gap-4">
      <div className="flex min-w-0 flex-col gap-4">
        <div className="flex min-w-0 flex-col overflow-hidden rounded-[var(--radius-card)] border border-rule bg-panel">
          <div className="flex items-center justify-between gap-3 border-b border-rule px-4 py-2.5">
            <h2 className="text-[13px] font-semibold">Placement</h2>
            <span className="text-xs text-ink-faint" data-testid="trims-state">
              {placing ? 'Click on a panel to place the trim.' : editable ? 'Drag a trim to move it; it lands on whole needles and courses.' : 'Read only.'}
            </span>
          </div>
          {generated ? <div className="border-b border-rule bg-spruce-50 px-4 py-1.5 text-xs text-spruce-700">No body map is saved yet: the panels are generated from the garment type.</div> : null}
          <div className="relative h-[540px] bg-[#f2f1ec]">
            <TrimCanvas
              panels={panels}
              textures={lookup}
              colourOf={colourOf}
              trims={canvasTrims}
              editable={editable}
              placing={placing}
              onSelect={(id) => {
                if (draft && (draft.id ?? 'new') === id) return;
                const t = id ? trims.find((x) => x.id === id) : undefined;
                if (t && editable) startEdit(t);
                else { setSelectedId(id); if (!id) close(); }
              }}
              onMove={(id, box) => void move(id, box)}
              onPlace={place}
            />
          </div>
        </div>
        <Card title="Findings" actions={<span className="figures text-xs text-ink-faint">{findings.length}</span>}>
          {findings.length === 0 ? (
            <p className="text-xs text-spruce-700">No findings: the trims pass the heat, placement and logo rules.</p>
          ) : (
            <ul className="space-y-1.5" data-testid="trim-findings">
              {findings.map((f, i) => (
                <li key={i}>
                  <button
                    type="button"
                    className={`w-full rounded px-2 py-1.5 text-left text-xs leading-5 ${f.severity === 'error' ? 'bg-madder-50 text-madder-700' : f.severity === 'warning' ? 'bg-ochre-50 text-ochre-700' : 'bg-paper text-ink-soft'}`}
                    onClick={() => {
                      const t = trims.find((x) => f.where.trimIds?.includes(x.id));
                      if (t && editable) startEdit(t);
                      else if (t) setSelectedId(t.id);
                    }}
                  >
                    {f.message}
                  </button>
                </li>
              ))}
            </ul>
          )}
          <p className="mt-3 text-[11px] leading-4 text-ink-faint">
            Heat limits are the fibre registry’s dry-heat values (mostly from memory); confirm with the trim supplier and a test press.
          </p>
        </Card>
      </div>

      <aside className="flex min-w-0 flex-col gap-4">
        {status.kind === 'conflict' ? (
          <Notice tone="warn"><span className="font-medium">Not saved.</span> {status.message} <button type="button" className="font-medium underline" onClick={() => window.location.reload()}>Reload</button></Notice>
        ) : null}
        {status.kind === 'error' && Object.keys(status.fields).length === 0 ? <Notice tone="error">{status.message}</Notice> : null}

        <Card title={`Trims · ${trims.length}`} actions={editable && !draft ? <Button size="sm" variant="primary" onClick={startNew}>Add a trim</Button> : null} className="[&>div]:p-0">
          {trims.length === 0 ? (
            <p className="px-4 py-3 text-sm text-ink-soft">No trims yet.</p>
          ) : (
            <ul aria-label="Trims">
              {trims.map((t) => {
                const mm = toMm(t.panelKind, t.box);
                const tone = toneOf(t.id);
                const active = t.id === activeId;
                return (
                  <li key={t.id} className={`border-b border-rule last:border-0 ${active ? 'bg-spruce-50/70' : ''}`}>
                    <button type="button" className="w-full px-4 py-2 text-left" onClick={() => (editable ? startEdit(t) : setSelectedId(t.id))} aria-current={active || undefined}>
                      <div className="flex items-center justify-between gap-2">
                        <span className="truncate text-sm font-medium">{t.name || trimKindLabels[t.kind]}</span>
                        {tone ? <span className={`rounded px-1.5 py-0.5 text-[10px] font-medium ${tone === 'error' ? 'bg-madder-50 text-madder-700' : tone === 'warning' ? 'bg-ochre-50 text-ochre-700' : 'bg-paper text-ink-soft'}`}>{tone === 'error' ? 'Finding' : tone === 'warning' ? 'Check' : 'Note'}</span> : null}
                      </div>
                      <div className="mt-0.5 text-xs text-ink-soft">
                        {trimKindLabels[t.kind]} · {trimMethodLabels[t.method]}{t.tempC !== null ? <> · <span className="figures">{t.tempC} °C</span></> : null} · {panelByKind.get(t.panelKind)?.name ?? t.panelKind}
                      </div>
                      <div className="figures mt-0.5 text-[11px] text-ink-faint">
                        {mm ? `${mm1(mm.widthMm)} × ${mm1(mm.heightMm)} mm · ` : ''}{t.box.width} × {t.box.height} st · needle {t.box.x}, course {t.box.y}
                      </div>
                    </button>
                  </li>
                );
              })}
            </ul>
          )}
        </Card>

        {draft && editable ? (
          <Card
            title={draft.id ? 'Edit trim' : 'New trim'}
            actions={<Button size="sm" variant="ghost" onClick={close}>Cancel</Button>}
          >
            <form className="space-y-3" onSubmit={(e) => { e.preventDefault(); void save(); }} aria-label={draft.id ? 'Edit trim' : 'New trim'}>
              <Field label="Name" error={fieldErr('name')}>{(id) => <Input id={id} value={draft.name} maxLength={80} placeholder="e.g. Chest logo" onChange={(e) => setDraft({ ...draft, name: e.target.value })} />}</Field>
              <div className="grid grid-cols-2 gap-3">
                <Field label="Kind" error={fieldErr('kind')}>
                  {(id) => (
                    <Select id={id} value={draft.kind} onChange={(e) => { const kind = e.target.value as TrimKind; setDraft({ ...draft, kind, method: methodsFor(kind).includes(draft.method) ? draft.method : defaultMethod[kind] }); }}>
                      {trimKinds.map((k) => <option key={k} value={k}>{trimKindLabels[k]}</option>)}
                    </Select>
                  )}
                </Field>
                <Field label="Method" error={fieldErr('method')}>
                  {(id) => (
                    <Select id={id} value={draft.method} onChange={(e) => setDraft({ ...draft, method: e.target.value as TrimMethod })}>
                      {methodsFor(draft.kind).map((m) => <option key={m} value={m}>{trimMethodLabels[m]}</option>)}
                    </Select>
                  )}
                </Field>
              </div>
              {heatMethod(draft.method) ? (
                <Field label="Application temperature, °C" error={fieldErr('tempC')} hint={underDraft[0]?.limits.length ? `Fabric under it: ${underDraft[0].limits.map(([f, c]) => `${fibres[f].names.eu} ≤ ${c} °C`).join(', ')}` : undefined}>
                  {(id) => <Input id={id} inputMode="decimal" className="figures" value={draft.tempC} onChange={(e) => setDraft({ ...draft, tempC: e.target.value })} />}
                </Field>
              ) : null}
              {draft.kind === 'knitted-logo' ? (
                <Field label="Finest line or gap of the artwork, mm" error={fieldErr('detailMm')} hint="Checked against one stitch of the texture it is knitted in.">
                  {(id) => <Input id={id} inputMode="decimal" className="figures" value={draft.detailMm} onChange={(e) => setDraft({ ...draft, detailMm: e.target.value })} />}
                </Field>
              ) : null}
              <div className="grid grid-cols-[1fr_1fr_1.2fr] gap-3">
                <Field label="Width, mm" error={fieldErr('size') ?? fieldErr('box.width')}>{(id) => <Input id={id} inputMode="decimal" className="figures" value={draft.widthMm} onChange={(e) => setDraft({ ...draft, widthMm: e.target.value })} />}</Field>
                <Field label="Height, mm" error={fieldErr('box.height')}>{(id) => <Input id={id} inputMode="decimal" className="figures" value={draft.heightMm} onChange={(e) => setDraft({ ...draft, heightMm: e.target.value })} />}</Field>
                <Field label="Panel" error={fieldErr('panelKind')}>
                  {(id) => (
                    <Select id={id} value={draft.panelKind} onChange={(e) => setDraft({ ...draft, panelKind: e.target.value as PanelKind })}>
                      {panelKinds.filter((k) => panelByKind.has(k)).map((k) => <option key={k} value={k}>{panelByKind.get(k)!.name}</option>)}
                    </Select>
                  )}
                </Field>
              </div>
              <p className="figures text-[11px] text-ink-faint">
                {(() => { const b = draftBox(draft); return b ? `${b.width} × ${b.height} stitches at needle ${b.x}, course ${b.y}` : 'Enter the size to place it.'; })()}
              </p>
              <div className="flex items-center gap-2">
                <Button type="submit" variant="primary" disabled={busy}>{busy ? 'Saving…' : draft.id ? 'Save trim' : 'Add trim'}</Button>
                <Button type="button" onClick={() => setPlacing((p) => !p)} aria-pressed={placing}>{placing ? 'Click a panel…' : 'Place on a panel'}</Button>
                {draft.id ? (
                  <Button type="button" variant="danger" className="ml-auto" disabled={busy} onClick={() => { const t = trims.find((x) => x.id === draft.id); if (t) void remove(t); }}>Delete</Button>
                ) : null}
              </div>
            </form>
          </Card>
        ) : selected ? (
          <Card title={selected.name || trimKindLabels[selected.kind]}>
            <dl className="grid grid-cols-[110px_1fr] gap-y-1 text-xs">
              <dt className="text-ink-faint">Kind</dt><dd>{trimKindLabels[selected.kind]}</dd>
              <dt className="text-ink-faint">Method</dt><dd>{trimMethodLabels[selected.method]}</dd>
              <dt className="text-ink-faint">Temperature</dt><dd className="figures">{selected.tempC === null ? '—' : `${selected.tempC} °C`}</dd>
              {selected.kind === 'knitted-logo' ? <><dt className="text-ink-faint">Finest detail</dt><dd className="figures">{selected.detailMm === null ? '—' : `${selected.detailMm} mm`}</dd></> : null}
              <dt className="text-ink-faint">Panel</dt><dd>{panelByKind.get(selected.panelKind)?.name ?? selected.panelKind}</dd>
            </dl>
          </Card>
        ) : null}

      </aside>
    </div>
  );
}
