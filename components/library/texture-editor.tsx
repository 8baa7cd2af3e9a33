'use client';

import { TextureTile } from '@/components/texture/texture-tile';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import type { LibraryTexture } from '@/lib/db/textures';
import type { LibraryYarn } from '@/lib/db/yarns';
import type { StudioRuleLimits } from '@/lib/rules/limits';
import { api, ApiError } from '@/lib/api/client';
import { blankChart, encodeCells, feederSetLetter, feederSets, type Chart } from '@/lib/library/chart';
import {
  textureFamilies, textureFamilyLabels, textureFunctionLabels, textureFunctions, textureInputSchema, toDomainTexture,
  type TextureFamily, type TextureFunction,
} from '@/lib/validations/library';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { FeederSetsEditor, feederSetColour, feederSetLabel, type FeederSetDraft } from './feeder-sets-editor';
import { ForceExtensionEditor, type CurvePointDraft } from './force-extension-editor';
import { FunctionBadge } from './function-badge';
import { StitchChartEditor } from './stitch-chart-editor';
import { TextureSummary } from './texture-summary';

/** The live texture handed to the preview slot (the renderer's tile component goes there). */
export interface TexturePreviewInput {
  texture: Texture;
  yarns: readonly Yarn[];
}

interface Meta {
  name: string;
  family: TextureFamily;
  fn: TextureFunction | '';
  gauge: string;
  walesPerCm: string;
  coursesPerCm: string;
  knit: string;
  tuck: string;
  notes: string;
}

/** What undo and redo step through: the chart (cells, a feeder set per course) and the sets. */
interface Work {
  chart: Chart<number>;
  sets: FeederSetDraft[];
}

interface History {
  past: Work[];
  present: Work;
  future: Work[];
}

const HISTORY_LIMIT = 100;
const str = (n: number) => String(Number(n.toFixed(6)));

function initialState(texture: LibraryTexture | undefined, yarns: readonly LibraryYarn[]): { meta: Meta; work: Work; curve: CurvePointDraft[] } {
  if (texture) {
    const { sets, courseSet } = feederSets(texture.feeders);
    return {
      meta: {
        name: texture.name, family: texture.family, fn: texture.function ?? '', gauge: str(texture.gauge),
        walesPerCm: str(texture.density.walesPerCm), coursesPerCm: str(texture.density.coursesPerCm),
        knit: str(texture.loopMm.knit), tuck: str(texture.loopMm.tuck), notes: texture.notes ?? '',
      },
      work: {
        chart: { cells: texture.repeat.cells.map((r) => [...r]), feeders: courseSet },
        sets: sets.map((s) => ({ ground: s.ground, plated: s.plated ? { yarn: s.plated.yarn, draft: str(s.plated.draft) } : null })),
      },
      curve: (texture.forceExtension ?? []).map((p) => ({ extensionPct: str(p.extension * 100), tension: str(p.tensionNPerCm) })),
    };
  }
  const ground = yarns.find((y) => y.fibres.some((f) => f.fibre === 'polyamide' && f.share === 1)) ?? yarns[0];
  const elastic = yarns.find((y) => y.fibres.length === 1 && y.fibres[0]?.fibre === 'elastane');
  return {
    meta: { name: '', family: 'jersey', fn: '', gauge: '28', walesPerCm: '20', coursesPerCm: '28', knit: '2.4', tuck: '1.8', notes: '' },
    work: { chart: blankChart(4, 4, 0), sets: [{ ground: ground?.id ?? '', plated: elastic ? { yarn: elastic.id, draft: '2.8' } : null }] },
    curve: [],
  };
}

/** The API entry of the editor's state (the same shape the routes and the seed take). */
function entryOf(meta: Meta, work: Work, curve: readonly CurvePointDraft[]) {
  const cells = work.chart.cells;
  return {
    name: meta.name,
    family: meta.family,
    function: meta.fn || null,
    gauge: meta.gauge,
    repeat: { needles: cells[0]?.length ?? 0, courses: cells.length, cells: encodeCells(cells) },
    feeders: work.chart.feeders.map((i) => {
      const s = work.sets[i];
      if (!s) return { ground: '' };
      return s.plated ? { ground: s.ground, plated: { yarn: s.plated.yarn, draft: s.plated.draft } } : { ground: s.ground };
    }),
    density: { walesPerCm: meta.walesPerCm, coursesPerCm: meta.coursesPerCm },
    loopMm: { knit: meta.knit, tuck: meta.tuck },
    forceExtension: curve.length
      ? curve.map((p) => {
          const pct = Number(p.extensionPct.replace(',', '.'));
          return { extension: p.extensionPct.trim() === '' ? '' : Number.isFinite(pct) ? pct / 100 : p.extensionPct, tensionNPerCm: p.tension };
        })
      : null,
    notes: meta.notes,
  };
}

export function TextureEditor({ texture, yarns, canEdit, ruleLimits, preview }: {
  texture?: LibraryTexture;
  yarns: LibraryYarn[];
  canEdit: boolean;
  /** The studio's float and tuck limits for the checks. */
  ruleLimits: StudioRuleLimits;
  /** The renderer's tile goes here: a node, or a function of the live texture. */
  preview?: React.ReactNode | ((live: TexturePreviewInput) => React.ReactNode);
}) {
  const router = useRouter();
  const qc = useQueryClient();
  const init = useMemo(() => initialState(texture, yarns), [texture, yarns]);
  const [meta, setMeta] = useState<Meta>(init.meta);
  const [curve, setCurve] = useState<CurvePointDraft[]>(init.curve);
  const [hist, setHist] = useState<History>({ past: [], present: init.work, future: [] });
  const [saved, setSaved] = useState(() => ({
    id: texture?.id ?? null,
    version: texture?.version ?? 0,
    baseline: texture ? JSON.stringify(entryOf(init.meta, init.work, init.curve)) : '',
  }));
  const [showErrors, setShowErrors] = useState(false);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<{ tone: 'info' | 'error'; message: string; stale?: boolean } | null>(null);
  const [saving, setSaving] = useState(false);
  const readOnly = !canEdit;
  const work = hist.present;
  const yarnById = useMemo(() => new Map(yarns.map((y) => [y.id, y])), [yarns]);

  const entry = useMemo(() => entryOf(meta, work, curve), [meta, work, curve]);
  const entryJson = JSON.stringify(entry);
  const dirty = entryJson !== saved.baseline;
  const parsed = useMemo(() => textureInputSchema.safeParse(entry), [entry]);

  const issues = useMemo(() => {
    const out: Record<string, string> = {};
    if (!parsed.success) for (const i of parsed.error.issues) out[i.path.join('.') || '_'] ??= i.message;
    return out;
  }, [parsed]);
  const errors = useMemo<Record<string, string>>(() => (showErrors ? { ...issues, ...serverErrors } : serverErrors), [showErrors, issues, serverErrors]);
  const err = (path: string) => errors[path];

  // The figures do not wait for a name.
  const structure = useMemo(
    () => (parsed.success ? parsed : textureInputSchema.safeParse({ ...entry, name: entry.name.trim().length >= 2 ? entry.name : 'Unnamed texture' })),
    [parsed, entry],
  );
  const live = useMemo(() => {
    if (!structure.success) {
      const messages = structure.error.issues.map((i) => i.message);
      return { texture: null, problems: [...new Set(messages)].slice(0, 6) };
    }
    const missing = structure.data.feeders.some((f) => !yarnById.has(f.ground) || (f.plated && !yarnById.has(f.plated.yarn)));
    if (missing) return { texture: null, problems: ['A feeder uses a yarn that is not in the library.'] };
    return { texture: toDomainTexture(saved.id ?? 'new', structure.data), problems: [] as string[] };
  }, [structure, yarnById, saved.id]);

  // Feeder errors, per set, in words with their course.
  const setErrors = useMemo(() => {
    const out: Record<number, string[]> = {};
    for (const [path, message] of Object.entries(errors)) {
      const m = /^feeders\.(\d+)/.exec(path);
      if (!m) continue;
      const course = Number(m[1]);
      const set = work.chart.feeders[course] ?? 0;
      const list = (out[set] ??= []);
      const text = `${message} (course ${course + 1}).`;
      if (!list.some((t) => t.startsWith(message))) list.push(text);
    }
    return out;
  }, [errors, work.chart.feeders]);

  const apply = useCallback((update: (w: Work) => Work, mark: boolean) => {
    setHist((h) => {
      const next = update(h.present);
      if (next === h.present) return h;
      return mark ? { past: [...h.past.slice(-(HISTORY_LIMIT - 1)), h.present], present: next, future: [] } : { ...h, present: next, future: [] };
    });
  }, []);
  const undo = useCallback(() => setHist((h) => {
    const prev = h.past[h.past.length - 1];
    return prev ? { past: h.past.slice(0, -1), present: prev, future: [h.present, ...h.future] } : h;
  }), []);
  const redo = useCallback(() => setHist((h) => {
    const next = h.future[0];
    return next ? { past: [...h.past, h.present], present: next, future: h.future.slice(1) } : h;
  }), []);

  const save = useCallback(async () => {
    if (readOnly || saving) return;
    setShowErrors(true);
    setServerErrors({});
    if (!parsed.success) {
      setNotice({ tone: 'error', message: 'Some fields need attention; nothing was saved yet.' });
      return;
    }
    setSaving(true);
    setNotice(null);
    try {
      if (saved.id) {
        const { texture: updated } = await api<{ texture: LibraryTexture }>(`/api/library/textures/${saved.id}`, {
          method: 'PATCH',
          json: { ...entry, version: saved.version },
        });
        setSaved({ id: updated.id, version: updated.version, baseline: entryJson });
        setNotice({ tone: 'info', message: `Saved · version ${updated.version}` });
        await qc.invalidateQueries({ queryKey: ['library'] });
      } else {
        const { texture: created } = await api<{ texture: LibraryTexture }>('/api/library/textures', { method: 'POST', json: entry });
        setSaved({ id: created.id, version: created.version, baseline: entryJson });
        await qc.invalidateQueries({ queryKey: ['library'] });
        router.replace(`/library/textures/${created.id}`);
      }
    } catch (e) {
      if (e instanceof ApiError) {
        setServerErrors(Object.fromEntries(Object.entries(e.fieldErrors).map(([k, v]) => [k, v[0] ?? ''])));
        setNotice({
          tone: 'error',
          message: e.status === 409 ? `${e.message}` : e.message,
          stale: e.status === 409,
        });
      } else {
        setNotice({ tone: 'error', message: 'Saving failed. Your edits are still here; try again.' });
      }
    } finally {
      setSaving(false);
    }
  }, [readOnly, saving, parsed, saved, entry, entryJson, qc, router]);

  const onArchive = async () => {
    if (!saved.id || !window.confirm(`Archive ${meta.name}? It leaves the library; nothing is deleted.`)) return;
    try {
      // The version this tab last saved or loaded: archiving over a newer save gets 409.
      await api(`/api/library/textures/${saved.id}?version=${saved.version}`, { method: 'DELETE' });
      await qc.invalidateQueries({ queryKey: ['library'] });
      router.push('/library');
    } catch (e) {
      setNotice({
        tone: 'error',
        message: e instanceof ApiError ? e.message : 'Archiving failed.',
        stale: e instanceof ApiError && e.status === 409 && 'currentVersion' in e.body,
      });
    }
  };

  // Ctrl+S saves; leaving with unsaved edits asks first.
  const saveRef = useRef(save);
  useEffect(() => {
    saveRef.current = save;
  }, [save]);
  useEffect(() => {
    if (readOnly) return;
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
        e.preventDefault();
        void saveRef.current();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [readOnly]);
  useEffect(() => {
    if (!dirty || readOnly) return;
    const onLeave = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', onLeave);
    return () => window.removeEventListener('beforeunload', onLeave);
  }, [dirty, readOnly]);

  const usage = work.sets.map((_, i) => work.chart.feeders.filter((s) => s === i).length);
  const setViews = work.sets.map((s, i) => ({ letter: feederSetLetter(i), colour: feederSetColour(i), label: feederSetLabel(s, yarnById) }));
  const gauge = Number(meta.gauge) > 0 ? Number(meta.gauge) : 28;
  const m = (patch: Partial<Meta>) => setMeta((x) => ({ ...x, ...patch }));
  const previewNode = typeof preview === 'function' ? (live.texture ? preview({ texture: live.texture, yarns }) : null) : preview;
  const chartErrors = Object.entries(errors).filter(([k]) => k === 'repeat' || k.startsWith('repeat.'));

  return (
    <div className={`space-y-5 ${readOnly ? '[&_input:disabled]:bg-paper [&_input:disabled]:text-ink-soft [&_select:disabled]:bg-paper [&_select:disabled]:text-ink-soft [&_textarea:disabled]:bg-paper' : ''}`}>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="flex items-center gap-3 text-[22px] font-semibold tracking-tight text-ink">
            {meta.name || (saved.id ? 'Untitled texture' : 'New texture')}
            <FunctionBadge fn={meta.fn || null} />
          </h1>
          <div className="mt-1 flex items-center gap-2 text-sm text-ink-soft">
            <span>{textureFamilyLabels[meta.family]}</span>
            <span aria-hidden>·</span>
            <span className="figures">{work.chart.cells[0]?.length ?? 0} × {work.chart.cells.length} repeat</span>
            <span aria-hidden>·</span>
            <span data-testid="save-state" className={`inline-flex items-center gap-1.5 ${dirty ? 'text-ochre-700' : ''}`}>
              <span aria-hidden className={`h-1.5 w-1.5 rounded-full ${dirty ? 'bg-ochre-500' : 'bg-spruce-500'}`} />
              {readOnly ? 'Read only' : dirty ? 'Unsaved changes' : saved.id ? `Saved · version ${saved.version}` : 'Not saved yet'}
            </span>
          </div>
        </div>
        {readOnly ? null : (
          <div className="flex items-center gap-2">
            {saved.id ? <Button type="button" variant="danger" onClick={onArchive}>Archive</Button> : null}
            <Button type="button" variant="primary" onClick={() => void save()} disabled={saving || (!dirty && !!saved.id)} title="Save (Ctrl+S)">
              {saving ? 'Saving…' : saved.id ? 'Save texture' : 'Create texture'}
            </Button>
          </div>
        )}
      </div>

      {notice ? (
        <Notice tone={notice.tone}>
          {notice.message}
          {notice.stale ? <> Your edits are still here. <button type="button" className="font-medium underline" onClick={() => window.location.reload()}>Reload</button> to see theirs (this drops your edits).</> : null}
        </Notice>
      ) : null}

      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,1fr)_380px]">
        <div className="min-w-0 space-y-5">
          <Card title="Structure">
            <fieldset disabled={readOnly} className="grid grid-cols-2 gap-4 md:grid-cols-8">
              <Field label="Name" error={err('name')} className="col-span-2 md:col-span-4">
                {(id) => <Input id={id} value={meta.name} aria-invalid={!!err('name')} onChange={(e) => m({ name: e.target.value })} />}
              </Field>
              <Field label="Family" error={err('family')} className="md:col-span-2">
                {(id) => (
                  <Select id={id} value={meta.family} onChange={(e) => m({ family: e.target.value as TextureFamily })}>
                    {textureFamilies.map((f) => <option key={f} value={f}>{textureFamilyLabels[f]}</option>)}
                  </Select>
                )}
              </Field>
              <Field label="Function" error={err('function')} className="md:col-span-2">
                {(id) => (
                  <Select id={id} value={meta.fn} onChange={(e) => m({ fn: e.target.value as TextureFunction | '' })}>
                    <option value="">General</option>
                    {textureFunctions.map((f) => <option key={f} value={f}>{textureFunctionLabels[f]}</option>)}
                  </Select>
                )}
              </Field>
              <Field label="Wales per cm" error={err('density.walesPerCm')} className="md:col-span-2">
                {(id) => <Input id={id} inputMode="decimal" className="figures" value={meta.walesPerCm} aria-invalid={!!err('density.walesPerCm')} onChange={(e) => m({ walesPerCm: e.target.value })} />}
              </Field>
              <Field label="Courses per cm" error={err('density.coursesPerCm')} className="md:col-span-2">
                {(id) => <Input id={id} inputMode="decimal" className="figures" value={meta.coursesPerCm} aria-invalid={!!err('density.coursesPerCm')} onChange={(e) => m({ coursesPerCm: e.target.value })} />}
              </Field>
              <Field label="Knit loop (mm)" error={err('loopMm.knit')} className="md:col-span-1">
                {(id) => <Input id={id} inputMode="decimal" className="figures" value={meta.knit} aria-invalid={!!err('loopMm.knit')} onChange={(e) => m({ knit: e.target.value })} />}
              </Field>
              <Field label="Tuck loop (mm)" error={err('loopMm.tuck')} className="md:col-span-1">
                {(id) => <Input id={id} inputMode="decimal" className="figures" value={meta.tuck} aria-invalid={!!err('loopMm.tuck')} onChange={(e) => m({ tuck: e.target.value })} />}
              </Field>
              <Field label="Gauge it was developed on (npi)" error={err('gauge')} className="md:col-span-2">
                {(id) => <Input id={id} inputMode="decimal" className="figures" value={meta.gauge} aria-invalid={!!err('gauge')} onChange={(e) => m({ gauge: e.target.value })} />}
              </Field>
            </fieldset>
          </Card>

          <Card title="Stitch chart" actions={<span className="text-xs text-ink-faint">Course 1 is knitted first (bottom row)</span>}>
            <StitchChartEditor
              chart={work.chart}
              sets={setViews}
              readOnly={readOnly}
              onChange={(next, { mark }) => apply((w) => ({ ...w, chart: next }), mark)}
              onUndo={undo}
              onRedo={redo}
              canUndo={hist.past.length > 0}
              canRedo={hist.future.length > 0}
            />
            {chartErrors.length ? (
              <ul className="mt-2 space-y-0.5">{chartErrors.map(([k, v]) => <li key={k} role="alert" className="text-xs text-madder-700">{v}</li>)}</ul>
            ) : null}
          </Card>

          <Card title="Feeder sets">
            <FeederSetsEditor
              sets={work.sets}
              usage={usage}
              yarns={yarns}
              readOnly={readOnly}
              errors={setErrors}
              onChange={(next, removed) =>
                apply(
                  (w) => ({
                    sets: next,
                    chart: removed === undefined ? w.chart : { ...w.chart, feeders: w.chart.feeders.map((i) => (i > removed ? i - 1 : i)) },
                  }),
                  true,
                )
              }
            />
          </Card>

          <div className="grid grid-cols-1 gap-5 lg:grid-cols-2">
            <Card title="Force–extension" actions={<span className="text-xs text-ink-faint">For the compression estimate</span>}>
              <ForceExtensionEditor points={curve} readOnly={readOnly} errors={errors} onChange={setCurve} />
            </Card>
            <Card title="Notes">
              <textarea
                aria-label="Notes"
                disabled={readOnly}
                value={meta.notes}
                onChange={(e) => m({ notes: e.target.value })}
                rows={5}
                className="block w-full resize-y rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm text-ink placeholder:text-ink-faint focus:border-spruce-500 focus:outline-none focus:ring-2 focus:ring-spruce-100"
                placeholder="What the mill should know: yarn path, take-down, finishing…"
              />
              {err('notes') ? <p role="alert" className="mt-1 text-xs text-madder-700">{err('notes')}</p> : null}
            </Card>
          </div>
        </div>

        <aside className="space-y-5 xl:sticky xl:top-16 xl:self-start">
          <Card title="Computed">
            <TextureSummary texture={live.texture} problems={live.problems} yarns={yarns} fn={meta.fn || null} gauge={gauge} courseSet={work.chart.feeders} ruleLimits={ruleLimits} />
          </Card>
          <Card title="Preview">
            <div data-slot="texture-preview" className="min-h-[8rem]">
              {previewNode ?? (live.texture ? <TexturePreview texture={live.texture} yarns={yarns} /> : (
                <div className="flex h-32 items-center justify-center rounded-md border border-dashed border-rule-strong bg-paper text-center text-xs text-ink-faint">
                  Fix the chart to see its rendering.
                </div>
              ))}
            </div>
          </Card>
        </aside>
      </div>
    </div>
  );
}

/** The texture tiled as knitted loops: magnified to read the structure, and at true size on screen. */
function TexturePreview({ texture, yarns }: { texture: Texture; yarns: readonly Yarn[] }) {
  const widthCm = texture.repeat.needles / texture.density.walesPerCm;
  const heightCm = texture.repeat.courses / texture.density.coursesPerCm;
  // Magnified so a needle is about 14 px; whole repeats filling about 300 × 200 px.
  const pxPerCm = 14 * texture.density.walesPerCm;
  const rx = Math.max(1, Math.ceil(300 / (widthCm * pxPerCm)));
  const ry = Math.max(1, Math.ceil(200 / (heightCm * pxPerCm)));
  const trueSize = 96 / 2.54;
  return (
    <div className="space-y-2">
      <div className="overflow-hidden rounded-md border border-rule">
        <TextureTile texture={texture} yarns={yarns} pxPerCm={pxPerCm} repeats={{ x: rx, y: ry }} className="block max-w-full" />
      </div>
      <div className="flex items-end gap-3">
        <div className="overflow-hidden rounded border border-rule">
          <TextureTile
            texture={texture}
            yarns={yarns}
            pxPerCm={trueSize}
            repeats={{ x: Math.max(1, Math.ceil(2 / widthCm)), y: Math.max(1, Math.ceil(2 / heightCm)) }}
            className="block"
          />
        </div>
        <p className="text-xs text-ink-faint">
          Left: about true size on a 96 dpi screen. Above: ×{(pxPerCm / trueSize).toFixed(0)}, {rx} × {ry} repeats of{' '}
          <span className="figures">{(widthCm * 10).toFixed(1)} × {(heightCm * 10).toFixed(1)} mm</span>.
        </p>
      </div>
    </div>
  );
}
