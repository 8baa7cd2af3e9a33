'use client';

import { useEffect, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Control, type Resolver, type UseFormRegister } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import { colourwayInputSchema, type ColourwayInput } from '@/lib/validations/colour';
import { targetRouteLabels, targetRoutes } from '@/lib/colour/colourway';
import type { Lab } from '@/lib/colour/lab';
import { fibres } from '@/lib/knit/fibres';
import type { ColourStandard } from '@/lib/db/colour-standards';
import type { Colourway, StyleYarn } from '@/lib/db/colourways';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { GamutNote, Swatch, fmtLab } from './swatch';
import { labToSrgbHex } from '@/lib/colour/convert';
import { colourKeys } from './use-colour';

type FormIn = z.input<typeof colourwayInputSchema>;
type TargetIn = NonNullable<FormIn['targets']>[number];

function toForm(cw: Colourway): FormIn {
  return {
    name: cw.name,
    notes: cw.notes,
    targets: cw.targets.map((t) => ({
      id: t.id,
      name: t.name,
      yarnIds: t.yarnIds,
      route: t.route,
      colour: t.source === 'standard' && t.standardId ? { source: 'standard', standardId: t.standardId } : { source: 'lab', lab: t.colour },
    })),
  };
}

const asNumber = (v: unknown) => (typeof v === 'number' ? v : typeof v === 'string' && v.trim() !== '' ? Number(v.replace(',', '.').replace('−', '-')) : NaN);

/** The colour a target's fields describe now, when they describe one. */
function liveColour(t: TargetIn | undefined, standards: readonly ColourStandard[]): Lab | null {
  if (!t?.colour) return null;
  const c = t.colour;
  if (c.source === 'standard') return standards.find((s) => s.id === c.standardId)?.lab ?? null;
  const lab = (c as { lab?: Record<string, unknown> }).lab ?? {};
  const L = asNumber(lab.L);
  const a = asNumber(lab.a);
  const b = asNumber(lab.b);
  return [L, a, b].every(Number.isFinite) && L >= 0 && L <= 100 ? { L, a, b } : null;
}

/** Dye classes of a yarn's fibres, for grouping suggestions. */
function classKey(y: StyleYarn): string {
  return [...new Set(y.fibres.filter((f) => f.share > 0).flatMap((f) => fibres[f.fibre].dyeClasses))].sort().join('+');
}

/**
 * One target per group of ground yarns that a garment-dyeing run would colour alike (the same dye
 * classes); plated yarns (bare elastane) are left out, as they show little.
 */
function suggestTargets(yarns: readonly StyleYarn[], taken: ReadonlySet<string>): TargetIn[] {
  const groups = new Map<string, StyleYarn[]>();
  for (const y of yarns) {
    if (y.colour.state !== 'dyeable' || y.feeds === 'plated' || taken.has(y.id)) continue;
    const k = classKey(y);
    if (!k) continue;
    groups.set(k, [...(groups.get(k) ?? []), y]);
  }
  return [...groups.values()]
    .sort((p, q) => q.length - p.length)
    .map((ys, i) => ({
      name: i === 0 && taken.size === 0 ? 'Ground' : `Accent ${i + (taken.size === 0 ? 0 : 1)}`,
      yarnIds: ys.map((y) => y.id),
      route: 'garment-dyed' as const,
      colour: { source: 'lab' as const, lab: { L: '', a: '', b: '' } as unknown as Lab },
    }));
}

export function TargetsEditor({
  styleId,
  colourway,
  yarns,
  standards,
}: {
  styleId: string;
  colourway: Colourway;
  yarns: readonly StyleYarn[];
  standards: readonly ColourStandard[];
}) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<{ message: string; stale: boolean } | null>(null);
  const [saved, setSaved] = useState(false);
  const form = useForm<FormIn, unknown, ColourwayInput>({
    resolver: zodResolver(colourwayInputSchema) as Resolver<FormIn, unknown, ColourwayInput>,
    defaultValues: toForm(colourway),
  });
  const { register, control, handleSubmit, formState, setError, reset, setValue, getValues } = form;
  const targets = useFieldArray({ control, name: 'targets' });
  const watched = (useWatch({ control, name: 'targets' }) ?? []) as TargetIn[];

  // A colourway saved elsewhere (or reloaded after a conflict) replaces the form when it is not being edited.
  useEffect(() => {
    if (!formState.isDirty) reset(toForm(colourway));
  }, [colourway, formState.isDirty, reset]);

  const dyeable = yarns.filter((y) => y.colour.state === 'dyeable');
  const coloured = yarns.filter((y) => y.colour.state !== 'dyeable');
  const ownerOf = (yarnId: string) => watched.findIndex((t) => (t?.yarnIds ?? []).includes(yarnId));
  const taken = new Set(watched.flatMap((t) => t?.yarnIds ?? []));
  const untargeted = dyeable.filter((y) => !taken.has(y.id));

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    setSaved(false);
    try {
      const res = await api<{ colourway: Colourway }>(`/api/styles/${styleId}/colourways/${colourway.id}`, {
        method: 'PATCH',
        json: { version: colourway.version, ...values },
      });
      reset(toForm(res.colourway));
      setSaved(true);
      await qc.invalidateQueries({ queryKey: colourKeys.colourways(styleId) });
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) setError(path as never, { message: msgs[0] });
        setServerError({ message: err.message, stale: err.status === 409 });
      } else setServerError({ message: 'Saving failed. Your changes are still here; try again.', stale: false });
    }
  });

  const reload = async () => {
    await qc.invalidateQueries({ queryKey: colourKeys.colourways(styleId) });
    const fresh = qc.getQueryData<{ colourways: Colourway[] }>(colourKeys.colourways(styleId))?.colourways.find((c) => c.id === colourway.id);
    reset(fresh ? toForm(fresh) : undefined);
    setServerError(null);
  };

  const errorAt = (path: string): string | undefined => {
    let node: unknown = formState.errors;
    for (const part of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
    return (node as { message?: string } | undefined)?.message;
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Colourway targets">
      {serverError ? (
        <Notice tone="error">
          {serverError.message}{' '}
          {serverError.stale ? (
            <button type="button" className="font-medium underline" onClick={reload}>Reload the saved colourway</button>
          ) : null}
        </Notice>
      ) : null}
      <div className="grid grid-cols-1 gap-3 md:grid-cols-[minmax(0,16rem)_1fr]">
        <Field label="Colourway name" error={errorAt('name')}>
          {(id) => <Input id={id} {...register('name')} aria-invalid={!!errorAt('name')} />}
        </Field>
        <Field label="Notes" error={errorAt('notes')}>
          {(id) => <Input id={id} {...register('notes')} placeholder="For the studio: what this colourway is for" />}
        </Field>
      </div>

      <ul className="space-y-3">
        {targets.fields.map((field, i) => (
          <TargetRow
            key={field.id}
            index={i}
            control={control}
            register={register}
            errorAt={errorAt}
            standards={standards}
            dyeable={dyeable}
            ownerOf={ownerOf}
            colour={liveColour(watched[i], standards)}
            onRemove={() => targets.remove(i)}
            onSource={(source) => {
              const current = liveColour(getValues(`targets.${i}`), standards);
              setValue(
                `targets.${i}.colour`,
                source === 'standard'
                  ? { source: 'standard', standardId: '' }
                  : { source: 'lab', lab: current ?? ({ L: '', a: '', b: '' } as unknown as Lab) },
                { shouldDirty: true },
              );
            }}
          />
        ))}
      </ul>
      {errorAt('targets') ? <p role="alert" className="text-xs text-madder-700">{errorAt('targets')}</p> : null}

      <div className="flex flex-wrap items-center gap-2">
        <Button
          type="button"
          size="sm"
          onClick={() =>
            targets.append({
              name: `Target ${targets.fields.length + 1}`,
              yarnIds: [],
              route: 'garment-dyed',
              colour: { source: 'lab', lab: { L: '', a: '', b: '' } as unknown as Lab },
            })
          }
        >
          Add target
        </Button>
        {untargeted.some((y) => y.feeds !== 'plated') ? (
          <Button type="button" size="sm" variant="ghost" onClick={() => suggestTargets(yarns, taken).forEach((t) => targets.append(t))}>
            Add a target per dye class
          </Button>
        ) : null}
        <div className="ml-auto flex items-center gap-3">
          {saved && !formState.isDirty ? <span role="status" className="text-xs text-spruce-700">Saved</span> : null}
          {formState.isDirty ? <span className="text-xs text-ink-faint">Unsaved changes</span> : null}
          <Button type="submit" variant="primary" disabled={formState.isSubmitting || !formState.isDirty}>
            {formState.isSubmitting ? 'Saving…' : 'Save colourway'}
          </Button>
        </div>
      </div>

      {untargeted.length || coloured.length ? (
        <div className="rounded-md border border-dashed border-rule-strong px-3 py-2 text-xs text-ink-soft">
          {untargeted.length ? (
            <p>
              <span className="font-medium text-ink">Without a target: </span>
              {untargeted.map((y) => y.name).join(', ')}. Garment baths colour them with whatever their dye class takes; bare
              elastane stays pale.
            </p>
          ) : null}
          {coloured.length ? (
            <p className={untargeted.length ? 'mt-1' : ''}>
              <span className="font-medium text-ink">Come coloured: </span>
              {coloured.map((y) => `${y.name} (${y.colour.state})`).join(', ')} keep their own colour.
            </p>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}

function TargetRow({
  index: i,
  control,
  register,
  errorAt,
  standards,
  dyeable,
  ownerOf,
  colour,
  onRemove,
  onSource,
}: {
  index: number;
  control: Control<FormIn, unknown, ColourwayInput>;
  register: UseFormRegister<FormIn>;
  errorAt: (path: string) => string | undefined;
  standards: readonly ColourStandard[];
  dyeable: readonly StyleYarn[];
  ownerOf: (yarnId: string) => number;
  colour: Lab | null;
  onRemove: () => void;
  onSource: (source: 'standard' | 'lab') => void;
}) {
  const source = useWatch({ control, name: `targets.${i}.colour.source` });
  const name = useWatch({ control, name: `targets.${i}.name` });
  const prefix = `targets.${i}`;
  return (
    <li className="rounded-md border border-rule bg-paper/40 p-3" data-testid={`target-${i}`}>
      <div className="grid grid-cols-1 gap-3 lg:grid-cols-[6rem_minmax(0,10rem)_minmax(0,12rem)_minmax(0,1fr)]">
        <div className="flex flex-col items-start gap-1 pt-5">
          {colour ? <Swatch lab={colour} size="lg" label={name || 'Target'} /> : (
            <span className="inline-flex h-16 w-24 items-center justify-center rounded-[5px] border border-dashed border-rule-strong text-2xs text-ink-faint">no colour yet</span>
          )}
          {colour ? (
            <span className="figures whitespace-nowrap text-[10px] leading-4 text-ink-faint">
              {fmtLab(colour).replace(/ \/ /g, '  ')}
              <br />
              {labToSrgbHex(colour)}
            </span>
          ) : null}
        </div>
        <div className="space-y-2">
          <Field label="Target name" error={errorAt(`${prefix}.name`)}>
            {(id) => <Input id={id} {...register(`targets.${i}.name`)} aria-invalid={!!errorAt(`${prefix}.name`)} />}
          </Field>
          <Field label="Dye route" error={errorAt(`${prefix}.route`)}>
            {(id) => (
              <Select id={id} {...register(`targets.${i}.route`)}>
                {targetRoutes.map((r) => <option key={r} value={r}>{targetRouteLabels[r]}</option>)}
              </Select>
            )}
          </Field>
        </div>
        <div className="space-y-2">
          <Field label="Colour from">
            {(id) => (
              <Select id={id} value={source ?? 'lab'} onChange={(e) => onSource(e.target.value as 'standard' | 'lab')}>
                <option value="standard">Colour standard</option>
                <option value="lab">L* a* b* entered</option>
              </Select>
            )}
          </Field>
          {source === 'standard' ? (
            <Field label="Colour standard" error={errorAt(`${prefix}.colour.standardId`)}>
              {(id) => (
                <Select id={id} {...register(`targets.${i}.colour.standardId` as never)} aria-invalid={!!errorAt(`${prefix}.colour.standardId`)}>
                  <option value="">Choose…</option>
                  {standards.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
                </Select>
              )}
            </Field>
          ) : (
            <div className="grid grid-cols-3 gap-1.5">
              {(['L', 'a', 'b'] as const).map((k) => (
                <Field key={k} label={`${k}*`} error={errorAt(`${prefix}.colour.lab.${k}`)}>
                  {(id) => (
                    <Input
                      id={id}
                      inputMode="decimal"
                      className="figures px-2"
                      {...register(`targets.${i}.colour.lab.${k}` as never)}
                      aria-invalid={!!errorAt(`${prefix}.colour.lab.${k}`)}
                    />
                  )}
                </Field>
              ))}
            </div>
          )}
          {colour ? <GamutNote lab={colour} /> : null}
        </div>
        <fieldset className="min-w-0">
          <legend className="mb-1 text-xs font-medium text-ink-soft">Yarns it colours</legend>
          <div className="max-h-40 space-y-0.5 overflow-y-auto rounded-md border border-rule bg-panel p-1.5">
            {dyeable.map((y) => {
              const owner = ownerOf(y.id);
              const elsewhere = owner >= 0 && owner !== i;
              return (
                <label key={y.id} className={`flex items-center gap-2 rounded px-1.5 py-1 text-sm ${elsewhere ? 'text-ink-faint' : 'hover:bg-paper'}`}>
                  <input type="checkbox" value={y.id} disabled={elsewhere} {...register(`targets.${i}.yarnIds`)} className="accent-spruce-600" />
                  <span className="min-w-0 flex-1 truncate">{y.name}</span>
                  <span className="shrink-0 text-2xs text-ink-faint">
                    {elsewhere ? `in target ${owner + 1}` : y.feeds === 'plated' ? 'plated' : y.fibres.map((f) => fibres[f.fibre].code).join('/')}
                  </span>
                </label>
              );
            })}
          </div>
          {errorAt(`${prefix}.yarnIds`) ? <p role="alert" className="mt-1 text-xs text-madder-700">{errorAt(`${prefix}.yarnIds`)}</p> : null}
        </fieldset>
      </div>
      <div className="mt-2 flex justify-end">
        <Button type="button" size="sm" variant="ghost" onClick={onRemove} aria-label={`Remove ${name || 'target'}`}>Remove target</Button>
      </div>
    </li>
  );
}
