'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import { useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api/client';
import { targetRouteLabels, type ColourwayRoute } from '@/lib/colour/colourway';
import { toleranceLabel } from '@/lib/colour/difference';
import type { Colourway, ColourwayTarget, StyleYarn } from '@/lib/db/colourways';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Input } from '@/components/ui/field';
import { ColourwayPreview, TextureFaceTiles } from './colourway-preview';
import { DyePlanPanel } from './dye-plan-panel';
import { LabDipForm } from './lab-dip-form';
import { LabDipsTable } from './lab-dips-table';
import { GamutNote, Swatch, fmtLab } from './swatch';
import { TargetsEditor } from './targets-editor';
import { colourKeys, useColourStandards, useColourways, useLabDips, usePreviewData } from './use-colour';

export interface ColourAbilities {
  /** Edit colourways (colour lead, admin). */
  edit: boolean;
  /** Approve or reject lab dips (colour lead, admin). */
  decide: boolean;
  /** Submit lab dips (mill, admin). */
  submit: boolean;
  /** Read the studio library's colour standards. */
  library: boolean;
  /** A client reviewer: approved colours only. */
  client: boolean;
  /** Read the working copy's body map for the preview (not the mill: it sees released revisions). */
  preview: boolean;
}

const routeLabel = (r: ColourwayRoute) => (r === 'mixed' ? 'Mixed routes' : r === 'none' ? 'No targets yet' : targetRouteLabels[r]);

/** The style workspace's Colour section: colourways, their dye plans, lab dips and a preview. */
export function ColourSection({ styleId, can }: { styleId: string; can: ColourAbilities }) {
  const colourways = useColourways(styleId);
  const labDips = useLabDips(styleId);
  const standards = useColourStandards(can.library);
  const preview = usePreviewData(styleId, can.preview);
  const [picked, setPicked] = useState<string | null>(null);

  const list = useMemo(() => colourways.data?.colourways ?? [], [colourways.data]);
  const current = list.find((c) => c.id === picked) ?? list[0];
  const yarns = colourways.data?.yarns ?? [];
  // With the dye plan (studio staff) the preview shows the dyed result; the client sees targets only.
  // Kept while the colourway is the same, so the preview's memos of the dyed look hold.
  const previewColourway = useMemo(() => (current ? { targets: current.targets, plan: current.plan ?? undefined } : undefined), [current]);

  if (colourways.isLoading) return <div className="h-40 animate-pulse rounded-[var(--radius-card)] bg-rule/50" />;
  if (colourways.error) return <Notice tone="error">Could not load the colourways: {colourways.error.message}</Notice>;

  const previewCard = !can.preview ? null : (
    <Card title="On the body">
      {preview.map.data && preview.textures.data ? (
        <div className="space-y-3">
          <div className="flex justify-center rounded-md bg-paper/60 p-2">
            <ColourwayPreview
              panels={preview.map.data.panels}
              textures={preview.textures.data.textures}
              yarns={preview.textures.data.yarns}
              colourway={previewColourway}
            />
          </div>
          <TextureFaceTiles textures={preview.textures.data.textures} yarns={preview.textures.data.yarns} colourway={previewColourway} />
          <p className="text-2xs text-ink-faint">
            Screen preview: each zone shows the yarns on the face of its texture in this colourway; bare elastane stays pale. The dashed
            line is the cut.{can.client ? ' Yarns whose colour is not approved yet show undyed.' : ''}
          </p>
        </div>
      ) : preview.map.error || preview.textures.error ? (
        <Notice tone="warn">The body map could not be loaded for the preview.</Notice>
      ) : (
        <div className="h-72 animate-pulse rounded bg-rule/50" />
      )}
    </Card>
  );

  if (can.client) {
    return (
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_460px]">
        <Card title="Approved colours">
          {list.length === 0 ? (
            <p className="text-sm text-ink-soft">No colours approved yet. They appear here once the studio approves the lab dips.</p>
          ) : (
            <div className="space-y-5">
              {list.map((cw) => (
                <section key={cw.id}>
                  <h3 className="mb-2 text-sm font-semibold">{cw.name}</h3>
                  <TargetList targets={cw.targets} yarns={yarns} showTolerance={false} />
                </section>
              ))}
            </div>
          )}
        </Card>
        {current ? previewCard : null}
      </div>
    );
  }

  const dipsOfCurrent = (labDips.data ?? []).filter((d) => d.colourwayId === current?.id);
  const awaiting = dipsOfCurrent.filter((d) => d.status === 'submitted').length;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <nav aria-label="Colourways" className="flex flex-wrap gap-1.5">
          {list.map((cw) => (
            <button
              key={cw.id}
              type="button"
              aria-pressed={cw.id === current?.id}
              onClick={() => setPicked(cw.id)}
              className={`inline-flex h-8 items-center gap-2 rounded-md border px-2.5 text-sm font-medium ${
                cw.id === current?.id ? 'border-spruce-600 bg-spruce-50 text-ink' : 'border-rule-strong bg-panel text-ink-soft hover:text-ink'
              }`}
            >
              <span className="flex -space-x-1">
                {cw.targets.slice(0, 4).map((t) => <Swatch key={t.id} lab={t.colour} size="sm" label={t.name} />)}
              </span>
              {cw.name}
            </button>
          ))}
        </nav>
        {can.edit ? <NewColourway styleId={styleId} onCreated={setPicked} /> : null}
        {can.library ? (
          <Link href="/library/colour-standards" className="ml-auto text-xs font-medium text-spruce-700 hover:underline">Colour standards library →</Link>
        ) : null}
      </div>

      {!current ? (
        <Card>
          <p className="text-sm text-ink-soft">
            No colourways yet.{' '}
            {can.edit ? 'Start one: name it, then give each yarn group that shows on the garment its target colour.' : 'The colour lead sets them up.'}
          </p>
        </Card>
      ) : (
        <>
          <div className={`grid grid-cols-1 gap-5 ${previewCard ? 'xl:grid-cols-[minmax(0,1fr)_440px]' : ''}`}>
            <div className="min-w-0 space-y-5">
              <Card
                title={<span>Targets <span className="ml-1 font-normal text-ink-faint">· {routeLabel(current.plan?.route ?? 'none')}</span></span>}
                actions={can.edit ? <ArchiveColourway styleId={styleId} colourway={current} onArchived={() => setPicked(null)} /> : null}
              >
                {current.unusedYarnIds.length ? (
                  <div className="mb-3">
                    <Notice tone="warn">Some targets name yarns the style no longer uses; the plan leaves them out. Save the colourway to drop them.</Notice>
                  </div>
                ) : null}
                {can.edit ? (
                  <TargetsEditor key={current.id} styleId={styleId} colourway={current} yarns={yarns} standards={standards.data ?? []} />
                ) : (
                  <>
                    {current.notes ? <p className="mb-3 text-sm text-ink-soft">{current.notes}</p> : null}
                    <TargetList targets={current.targets} yarns={yarns} showTolerance />
                  </>
                )}
              </Card>
              {current.plan ? (
                <Card title="Dye plan">
                  <DyePlanPanel plan={current.plan} targets={current.targets} yarns={yarns} />
                </Card>
              ) : null}
            </div>
            {previewCard ? <div className="min-w-0">{previewCard}</div> : null}
          </div>
          <div className={`grid grid-cols-1 gap-5 ${can.submit ? 'xl:grid-cols-[minmax(0,1fr)_440px]' : ''}`}>
            <Card
              className="min-w-0"
              title={
                <span>
                  Lab dips · {current.name}
                  {awaiting ? <span className="ml-2 rounded-full bg-ochre-50 px-2 py-0.5 text-2xs font-medium text-ochre-700 ring-1 ring-ochre-500/25">{awaiting} awaiting decision</span> : null}
                </span>
              }
            >
              {labDips.error ? (
                <Notice tone="error">Could not load the lab dips: {labDips.error.message}</Notice>
              ) : (
                <LabDipsTable styleId={styleId} labDips={dipsOfCurrent} canDecide={can.decide} showSubmitter={!can.submit || can.edit} />
              )}
            </Card>
            {can.submit ? (
              <Card title="Send a lab dip">
                <LabDipForm key={current.id} styleId={styleId} colourways={list} initialColourwayId={current.id} />
              </Card>
            ) : null}
          </div>
        </>
      )}
    </div>
  );
}

/** Targets as a read-only list: colour, values, route, yarns, tolerance. */
function TargetList({ targets, yarns, showTolerance }: { targets: readonly ColourwayTarget[]; yarns: readonly StyleYarn[]; showTolerance: boolean }) {
  if (targets.length === 0) return <p className="text-sm text-ink-soft">No targets yet.</p>;
  const name = (id: string) => yarns.find((y) => y.id === id)?.name ?? 'a yarn no longer in the style';
  return (
    <ul className="divide-y divide-rule">
      {targets.map((t) => (
        <li key={t.id} className="flex gap-3 py-2.5">
          <Swatch lab={t.colour} size="lg" label={t.name} />
          <div className="min-w-0 text-sm">
            <div className="font-medium">
              {t.name}
              {t.standardName ? <span className="ml-2 font-normal text-ink-soft">{t.standardName}</span> : null}
              {t.approval === 'changed-since-approval' ? (
                <span
                  data-approval="changed-since-approval"
                  title="A lab dip was approved against another colour; the client does not see this target until a dip of the current colour is approved."
                  className="ml-2 rounded px-1.5 py-0.5 text-xs font-medium bg-ochre-50 text-ochre-700 ring-1 ring-ochre-500/25"
                >
                  Changed since approval
                </span>
              ) : t.approval === 'approved' ? (
                <span data-approval="approved" className="ml-2 rounded px-1.5 py-0.5 text-xs font-medium bg-spruce-600 text-white">Approved</span>
              ) : null}
            </div>
            <div className="figures text-xs text-ink-soft">L* a* b* {fmtLab(t.colour)}</div>
            <div className="text-xs text-ink-soft">
              {targetRouteLabels[t.route]} · {t.yarnIds.map(name).join(', ')}
              {showTolerance ? <> · accepts {toleranceLabel(t.tolerance)}</> : null}
            </div>
            <GamutNote lab={t.colour} />
          </div>
        </li>
      ))}
    </ul>
  );
}

function NewColourway({ styleId, onCreated }: { styleId: string; onCreated: (id: string) => void }) {
  const qc = useQueryClient();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  if (!open) return <Button size="sm" onClick={() => setOpen(true)}>New colourway</Button>;
  const create = async (e: React.FormEvent) => {
    e.preventDefault();
    setError(null);
    try {
      const res = await api<{ colourway: Colourway }>(`/api/styles/${styleId}/colourways`, { method: 'POST', json: { name } });
      await qc.invalidateQueries({ queryKey: colourKeys.colourways(styleId) });
      onCreated(res.colourway.id);
      setOpen(false);
      setName('');
    } catch (err) {
      setError(err instanceof ApiError ? (err.fieldErrors.name?.[0] ?? err.message) : 'That did not work; try again.');
    }
  };
  return (
    <form onSubmit={create} className="flex items-center gap-1.5">
      <Input aria-label="New colourway name" placeholder="Colourway name" className="h-8 w-48" value={name} onChange={(e) => setName(e.target.value)} autoFocus />
      <Button size="sm" variant="primary" type="submit">Create</Button>
      <Button size="sm" variant="ghost" type="button" onClick={() => setOpen(false)}>Cancel</Button>
      {error ? <span role="alert" className="text-xs text-madder-700">{error}</span> : null}
    </form>
  );
}

function ArchiveColourway({ styleId, colourway, onArchived }: { styleId: string; colourway: Colourway; onArchived: () => void }) {
  const qc = useQueryClient();
  const [confirm, setConfirm] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const archive = async () => {
    try {
      await api(`/api/styles/${styleId}/colourways/${colourway.id}`, { method: 'DELETE' });
      await qc.invalidateQueries({ queryKey: colourKeys.colourways(styleId) });
      onArchived();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'That did not work.');
    }
  };
  if (!confirm) return <Button size="sm" variant="ghost" onClick={() => setConfirm(true)}>Archive</Button>;
  return (
    <span className="flex items-center gap-1.5 text-xs">
      {error ? <span role="alert" className="text-madder-700">{error}</span> : <span className="text-ink-soft">Archive {colourway.name}? Its lab dips are kept.</span>}
      <Button size="sm" variant="danger" onClick={archive}>Archive</Button>
      <Button size="sm" variant="ghost" onClick={() => setConfirm(false)}>Keep</Button>
    </span>
  );
}
