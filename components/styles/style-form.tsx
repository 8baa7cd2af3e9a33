'use client';

import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { z } from 'zod';
import {
  constructionLabels, constructions, garmentTypeLabels, garmentTypes, sleeveStyleLabels, styleCreateSchema, styleStatuses, styleStatusLabels,
  type StyleCreate,
} from '@/lib/validations/style';
import type { Style } from '@/lib/db/styles';
import { cylinderNeedles } from '@/lib/fit/needles';
import { sleeveStyles } from '@/lib/knit/outline';
import { api, ApiError } from '@/lib/api/client';
import { Field, Input, Select } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { useOrganisations } from './use-styles';

type FormIn = z.input<typeof styleCreateSchema>;

const splitSizes = (v: unknown) => (typeof v === 'string' ? v.split(/[\s,;/]+/).map((s) => s.trim()).filter(Boolean) : v);

const defaults: FormIn = {
  code: '', name: '', season: '', clientId: null, garmentType: 'long-sleeve-top', construction: 'seamless',
  machine: { kind: 'circular', diameterIn: 14, gauge: 28, needleMultiple: 4, feeders: 8, maxYarns: 3 },
  sizes: { labels: ['XS', 'S', 'M', 'L', 'XL'], base: 'M' }, status: 'draft',
};

function toForm(s: Style): FormIn {
  return { code: s.code, name: s.name, season: s.season, clientId: s.clientId, garmentType: s.garmentType, construction: s.construction, machine: s.machine, sizes: s.sizes, status: s.status };
}

export function StyleForm({ style, readOnly = false }: { style?: Style; readOnly?: boolean }) {
  const router = useRouter();
  const qc = useQueryClient();
  const orgs = useOrganisations(!readOnly);
  const [serverError, setServerError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  // The version this form last saw: its own saves raise it at once, without waiting for the page to
  // refresh; a newer version from someone else is not taken over silently (it answers 409).
  const [version, setVersion] = useState(style?.version ?? 0);
  const form = useForm<FormIn, unknown, StyleCreate>({
    resolver: zodResolver(styleCreateSchema) as Resolver<FormIn, unknown, StyleCreate>,
    defaultValues: style ? toForm(style) : defaults,
  });
  const { register, handleSubmit, formState, setValue, setError, control, reset } = form;
  const errors = formState.errors;
  const construction = useWatch({ control, name: 'construction' });
  const machine = useWatch({ control, name: 'machine' }) as FormIn['machine'];
  const sizeLabels = (useWatch({ control, name: 'sizes.labels' }) as unknown as string[] | string) ?? [];
  const labels = Array.isArray(sizeLabels) ? sizeLabels : (splitSizes(sizeLabels) as string[]);

  const onConstruction = (value: string) => {
    if (value === 'flat') setValue('machine', { kind: 'flat', gauge: 14, bedNeedles: 1000, maxYarns: 6 });
    else setValue('machine', defaults.machine);
  };

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    setSaved(false);
    try {
      if (style) {
        const { style: updated } = await api<{ style: Style }>(`/api/styles/${style.id}`, {
          method: 'PATCH',
          json: { ...values, version },
        });
        setVersion(updated.version);
        qc.setQueryData(['styles', style.id], updated);
        await qc.invalidateQueries({ queryKey: ['styles'] });
        reset(toForm(updated));
        setSaved(true);
        router.refresh();
      } else {
        const { style: created } = await api<{ style: Style }>('/api/styles', { method: 'POST', json: values });
        await qc.invalidateQueries({ queryKey: ['styles'] });
        router.push(`/styles/${created.id}`);
      }
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) {
          setError(path as keyof FormIn, { message: msgs[0] });
        }
        setServerError(err.status === 409 ? `${err.message}` : err.message);
      } else setServerError('Saving failed.');
    }
  });

  const needles =
    machine?.kind === 'circular' && Number(machine.diameterIn) > 0 && Number(machine.gauge) > 0
      ? cylinderNeedles(Number(machine.diameterIn), Number(machine.gauge), Number(machine.needleMultiple) || 1)
      : null;
  const err = (path: string) => {
    const parts = path.split('.');
    let e: unknown = errors;
    for (const p of parts) e = (e as Record<string, unknown> | undefined)?.[p];
    return (e as { message?: string } | undefined)?.message;
  };
  // Until the organisations load, offer the style's own client so the select shows it from the start.
  const clients = orgs.data
    ? orgs.data.filter((o) => o.kind === 'client')
    : style?.clientId
      ? [{ id: style.clientId, name: style.clientName ?? '' }]
      : [];

  const sleeveField = (
    <Field label="Sleeves" error={err('machine.sleeveStyle')} hint="Shapes the generated outlines until the body map is first saved">
      {(id) => (
        <Select id={id} {...register('machine.sleeveStyle', { setValueAs: (v) => v || undefined })}>
          {sleeveStyles.map((k) => <option key={k} value={k}>{sleeveStyleLabels[k]}</option>)}
        </Select>
      )}
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6">
      {serverError ? <Notice tone="error">{serverError}</Notice> : null}
      {saved ? <Notice tone="info">Saved.</Notice> : null}
      <fieldset disabled={readOnly} className="grid grid-cols-1 gap-4 md:grid-cols-3">
        <Field label="Style code" error={err('code')}>{(id) => <Input id={id} className="figures" aria-invalid={!!errors.code} {...register('code')} />}</Field>
        <Field label="Name" error={err('name')} className="md:col-span-2">{(id) => <Input id={id} aria-invalid={!!errors.name} {...register('name')} />}</Field>
        <Field label="Season" error={err('season')}>{(id) => <Input id={id} placeholder="SS27" {...register('season')} />}</Field>
        <Field label="Client" error={err('clientId')}>
          {(id) => (
            <Select id={id} {...register('clientId', { setValueAs: (v) => (v ? v : null) })}>
              <option value="">No client yet</option>
              {clients.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
            </Select>
          )}
        </Field>
        <Field label="Status" error={err('status')}>
          {(id) => <Select id={id} {...register('status')}>{styleStatuses.map((s) => <option key={s} value={s}>{styleStatusLabels[s]}</option>)}</Select>}
        </Field>
        <Field label="Garment type" error={err('garmentType')}>
          {(id) => <Select id={id} {...register('garmentType')}>{garmentTypes.map((g) => <option key={g} value={g}>{garmentTypeLabels[g]}</option>)}</Select>}
        </Field>
        <Field label="Construction" error={err('construction')}>
          {(id) => (
            <Select id={id} {...register('construction', { onChange: (e) => onConstruction(e.target.value) })}>
              {constructions.map((c) => <option key={c} value={c}>{constructionLabels[c]}</option>)}
            </Select>
          )}
        </Field>
        <Field label="Sizes" error={err('sizes.labels')} hint="Separated by commas or spaces">
          {(id) => <Input id={id} className="figures" defaultValue={labels.join(', ')} {...register('sizes.labels', { setValueAs: splitSizes })} />}
        </Field>
        <Field label="Base size" error={err('sizes.base')}>
          {(id) => <Select id={id} {...register('sizes.base')}>{labels.map((l) => <option key={l} value={l}>{l}</option>)}</Select>}
        </Field>
      </fieldset>

      <fieldset disabled={readOnly} className="rounded-md border border-rule bg-paper/50 p-4">
        <legend className="px-1 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">
          {construction === 'flat' ? 'V-bed machine' : 'Circular machine'}
        </legend>
        {construction === 'flat' ? (
          <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
            <Field label="Gauge (needles per inch)" error={err('machine.gauge')}>{(id) => <Input id={id} type="number" step="any" className="figures" {...register('machine.gauge')} />}</Field>
            <Field label="Bed width (needles)" error={err('machine.bedNeedles')}>{(id) => <Input id={id} type="number" className="figures" {...register('machine.bedNeedles' as 'machine.gauge')} />}</Field>
            <Field label="Yarn carriers usable" error={err('machine.maxYarns')}>{(id) => <Input id={id} type="number" className="figures" {...register('machine.maxYarns')} />}</Field>
            {sleeveField}
          </div>
        ) : (
          <div className="grid grid-cols-2 gap-4 md:grid-cols-6">
            <Field label="Cylinder diameter (in)" error={err('machine.diameterIn')}>{(id) => <Input id={id} type="number" step="any" className="figures" {...register('machine.diameterIn' as 'machine.gauge')} />}</Field>
            <Field label="Gauge (needles per inch)" error={err('machine.gauge')}>{(id) => <Input id={id} type="number" step="any" className="figures" {...register('machine.gauge')} />}</Field>
            <Field label="Needle multiple" error={err('machine.needleMultiple')}>{(id) => <Input id={id} type="number" className="figures" {...register('machine.needleMultiple' as 'machine.gauge')} />}</Field>
            <Field label="Feeders" error={err('machine.feeders')}>{(id) => <Input id={id} type="number" className="figures" {...register('machine.feeders' as 'machine.gauge')} />}</Field>
            <Field label="Distinct yarns carried" error={err('machine.maxYarns')} hint="Common practice: 2–3 on a seamless machine">{(id) => <Input id={id} type="number" className="figures" {...register('machine.maxYarns')} />}</Field>
            <div className="space-y-1">
              <div className="text-xs font-medium text-ink-soft">Needles (π × D × gauge)</div>
              <div className="figures flex h-9 items-center text-base font-semibold text-ink" data-testid="needle-count">{needles ?? '—'}</div>
            </div>
            {sleeveField}
          </div>
        )}
      </fieldset>

      {readOnly ? null : (
        <div className="flex items-center gap-2">
          <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? 'Saving…' : style ? 'Save changes' : 'Create style'}
          </Button>
          {style ? null : <Button type="button" variant="ghost" onClick={() => router.push('/styles')}>Cancel</Button>}
        </div>
      )}
    </form>
  );
}
