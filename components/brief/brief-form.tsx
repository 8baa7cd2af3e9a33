'use client';

import { useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import type { Brief } from '@/lib/db/briefs';
import { fibreIds, fibres } from '@/lib/knit/fibres';
import { briefCompressionLevels, marketLabels, markets } from '@/lib/rules/brief';
import {
  briefAnswersSchema, climateLabels, climates, sportLevelLabels, sportLevels, stretchLabels, stretchLevels, supportLevels, type BriefAnswers,
} from '@/lib/validations/brief';
import { Field, Input, Select } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { briefKey, briefVersionsKey, checksKey } from './use-brief';

type FormIn = z.input<typeof briefAnswersSchema> & { orderBySize?: Record<string, unknown> };

const textarea =
  'block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm text-ink shadow-xs focus:border-spruce-500 focus:outline-none focus:ring-2 focus:ring-spruce-100';

function Group({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <fieldset className="space-y-3 border-t border-rule pt-3 first:border-t-0 first:pt-0">
      <legend className="mb-1 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">{title}</legend>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

export function BriefForm({ styleId, brief, sizes, readOnly }: { styleId: string; brief: Brief; sizes: string[]; readOnly: boolean }) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<string | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const [version, setVersion] = useState(brief.version);
  const form = useForm<FormIn, unknown, BriefAnswers>({
    resolver: zodResolver(briefAnswersSchema) as Resolver<FormIn, unknown, BriefAnswers>,
    defaultValues: brief.answers as FormIn,
  });
  const { register, handleSubmit, formState, setError, reset } = form;
  const e = formState.errors as Record<string, { message?: string } | undefined> & { orderBySize?: Record<string, { message?: string }> };
  const err = (k: string) => e[k]?.message;

  const onSubmit = handleSubmit(async (answers) => {
    setServerError(null);
    try {
      const res = await api<{ brief: Brief }>(`/api/styles/${styleId}/brief`, { method: 'PUT', json: { version, answers } });
      setVersion(res.brief.version);
      reset(res.brief.answers as FormIn);
      qc.setQueryData(briefKey(styleId), res.brief);
      await Promise.all([qc.invalidateQueries({ queryKey: checksKey(styleId) }), qc.invalidateQueries({ queryKey: briefVersionsKey(styleId) })]);
      setSavedAt(new Date().toLocaleTimeString());
    } catch (x) {
      if (x instanceof ApiError) {
        for (const [path, msgs] of Object.entries(x.fieldErrors)) {
          setError(path.replace(/^answers\./, '') as keyof FormIn, { message: msgs[0] });
        }
        setServerError(x.status === 409 ? `${x.message}` : x.message);
      } else setServerError('Could not save the brief.');
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" aria-label="Brief questionnaire" noValidate>
      <fieldset disabled={readOnly} className="space-y-4">
        <Group title="Client and customers">
          <Field label="Customers" error={err('customers')} className="sm:col-span-2">{(id) => <Input id={id} {...register('customers')} />}</Field>
          <Field label="Sport" error={err('sport')}>{(id) => <Input id={id} {...register('sport')} />}</Field>
          <Field label="Level">{(id) => (
            <Select id={id} {...register('level')}><option value="">—</option>{sportLevels.map((l) => <option key={l} value={l}>{sportLevelLabels[l]}</option>)}</Select>
          )}</Field>
          <Field label="Climate">{(id) => (
            <Select id={id} {...register('climate')}><option value="">—</option>{climates.map((c) => <option key={c} value={c}>{climateLabels[c]}</option>)}</Select>
          )}</Field>
          <Field label="Season" error={err('season')}>{(id) => <Input id={id} {...register('season')} />}</Field>
        </Group>
        <Group title="Purpose and functional targets">
          <Field label="Purpose" error={err('purpose')} className="sm:col-span-2 lg:col-span-3">{(id) => <textarea id={id} rows={2} className={textarea} {...register('purpose')} />}</Field>
          <Field label="Compression level">{(id) => (
            <Select id={id} {...register('compression')}><option value="">—</option>{briefCompressionLevels.map((c) => <option key={c} value={c}>{c}</option>)}</Select>
          )}</Field>
          <Field label="Ventilation areas" error={err('ventilationAreas')}>{(id) => <Input id={id} {...register('ventilationAreas')} />}</Field>
          <Field label="Support">{(id) => (
            <Select id={id} {...register('support')}><option value="">—</option>{supportLevels.map((s) => <option key={s} value={s}>{s}</option>)}</Select>
          )}</Field>
          <Field label="Stretch">{(id) => (
            <Select id={id} {...register('stretch')}><option value="">—</option>{stretchLevels.map((s) => <option key={s} value={s}>{stretchLabels[s]}</option>)}</Select>
          )}</Field>
          <Field label="Weight target" error={err('weightTarget')}>{(id) => (
            <div className="flex gap-2">
              <Input id={id} inputMode="decimal" className="w-28" {...register('weightTarget')} />
              <Select aria-label="Weight unit" className="w-40" {...register('weightUnit')}><option value="gsm">g/m²</option><option value="garment">g per garment</option></Select>
            </div>
          )}</Field>
          <Field label="Care expectations" error={err('care')}>{(id) => <Input id={id} {...register('care')} />}</Field>
        </Group>
        <Group title="Colour">
          <Field label="Colour intent" error={err('colourIntent')} className="sm:col-span-2">{(id) => <Input id={id} {...register('colourIntent')} />}</Field>
          <Field label="Number of tones" error={err('tones')}>{(id) => <Input id={id} inputMode="numeric" className="w-24" {...register('tones')} />}</Field>
        </Group>
        <Group title="Price, order and dates">
          {brief.pricesHidden ? null : (
            <Field label="Target price per garment" error={err('targetPrice')} hint="Studio only: never shown to the client or the mill">{(id) => <Input id={id} inputMode="decimal" className="w-32" {...register('targetPrice')} />}</Field>
          )}
          <Field label="Sample date" error={err('sampleDate')}>{(id) => <Input id={id} type="date" className="w-44" {...register('sampleDate')} />}</Field>
          <Field label="Delivery date" error={err('deliveryDate')}>{(id) => <Input id={id} type="date" className="w-44" {...register('deliveryDate')} />}</Field>
          <div className="sm:col-span-2 lg:col-span-3">
            <div className="mb-1 text-xs font-medium text-ink-soft">Order size per size</div>
            <div className="flex flex-wrap gap-2">
              {sizes.map((s) => (
                <Field key={s} label={`Garments, ${s}`} error={e.orderBySize?.[s]?.message}>
                  {(id) => <Input id={id} inputMode="numeric" className="w-24" {...register(`orderBySize.${s}` as 'customers', { setValueAs: (v) => (v === '' || v === null || v === undefined ? undefined : Number(v)) })} />}
                </Field>
              ))}
            </div>
          </div>
        </Group>
        <Group title="Constraints">
          <Field label="Recycled content, at least %" error={err('recycledPct')}>{(id) => <Input id={id} inputMode="decimal" className="w-24" {...register('recycledPct')} />}</Field>
          <div className="sm:col-span-2">
            <div className="mb-1 text-xs font-medium text-ink-soft">Markets (decide the label regions)</div>
            <div className="flex flex-wrap gap-x-4 gap-y-1">
              {markets.map((m) => (
                <label key={m} className="flex items-center gap-1.5 text-sm"><input type="checkbox" value={m} {...register('markets')} />{marketLabels[m]}</label>
              ))}
            </div>
          </div>
          <div className="sm:col-span-2 lg:col-span-3">
            <div className="mb-1 text-xs font-medium text-ink-soft">Fibres to avoid</div>
            <div className="flex flex-wrap gap-x-4 gap-y-1">
              {fibreIds.map((f) => (
                <label key={f} className="flex items-center gap-1.5 text-sm"><input type="checkbox" value={f} {...register('fibresToAvoid')} />{f === 'polyester-cd' ? 'cationic-dyeable polyester' : fibres[f].names.eu}</label>
              ))}
            </div>
          </div>
        </Group>
      </fieldset>
      {serverError ? <Notice tone="error">{serverError}</Notice> : null}
      {readOnly ? null : (
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" disabled={formState.isSubmitting}>{formState.isSubmitting ? 'Saving…' : 'Save brief'}</Button>
          {savedAt ? <span role="status" className="text-xs text-ink-soft">Saved at {savedAt}</span> : brief.updatedAt ? <span className="text-xs text-ink-faint">Last saved {new Date(brief.updatedAt).toLocaleString()}{brief.updatedBy ? ` by ${brief.updatedBy}` : ''}</span> : null}
        </div>
      )}
    </form>
  );
}
