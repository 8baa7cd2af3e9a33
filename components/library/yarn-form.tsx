'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { FormProvider, get, useFieldArray, useForm, useFormContext, useWatch, type Resolver, type UseFormRegisterReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { formatCount, type CountUnit } from '@/lib/knit/count';
import { fibreIds, fibres, type FibreId } from '@/lib/knit/fibres';
import { coveredYarn, type YarnFibre } from '@/lib/knit/yarn';
import { labToSrgbHex, inSrgbGamut } from '@/lib/colour/convert';
import type { LibraryYarn } from '@/lib/db/yarns';
import { api, ApiError } from '@/lib/api/client';
import {
  colourStateLabels, colourStates, lustreLabels, lustres, makeUpKindLabels, makeUpKinds, yarnEntryOf, yarnInputSchema,
  type ColourState, type Lustre, type MakeUpKind, type YarnEntry, type YarnInput,
} from '@/lib/validations/library';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { CountInput, typedDtex } from './count-input';
import { fibreLabel, fibreName, formatPct } from './format';

type Num = number | string | null;
interface CountField { value: Num; unit: CountUnit }

/** The form holds every make-up at once, so switching kinds keeps what was typed; zod reads the chosen one. */
export interface YarnFormValues {
  name: string;
  supplierRef: string;
  count: CountField;
  filaments: Num;
  lustre: Lustre | '' | null;
  staple: boolean;
  makeUp: {
    kind: MakeUpKind;
    fibre: FibreId;
    fibres: { fibre: FibreId; sharePct: Num }[];
    core: { fibre: FibreId; count: CountField; draft: Num };
    cover: { fibre: FibreId; count: CountField; takeUpPct: Num };
  };
  colour: { state: ColourState; lab: { L: Num; a: Num; b: Num } };
  pricePerKg: Num;
  recycledPct: Num;
}

const blank: YarnFormValues = {
  name: '',
  supplierRef: '',
  count: { value: '', unit: 'dtex' },
  filaments: '',
  lustre: '',
  staple: false,
  makeUp: {
    kind: 'single',
    fibre: 'polyamide',
    fibres: [{ fibre: 'polyamide', sharePct: 80 }, { fibre: 'elastane', sharePct: 20 }],
    core: { fibre: 'elastane', count: { value: 20, unit: 'den' }, draft: 3.2 },
    cover: { fibre: 'polyamide', count: { value: 40, unit: 'den' }, takeUpPct: 12 },
  },
  colour: { state: 'dyeable', lab: { L: 50, a: 0, b: 0 } },
  pricePerKg: '',
  recycledPct: '',
};

function toFormValues(y?: LibraryYarn): YarnFormValues {
  if (!y) return structuredClone(blank);
  const e = yarnEntryOf(y) as {
    name: string; supplierRef: string; count?: CountField; filaments: Num; lustre: Lustre | null; staple: boolean;
    makeUp: { kind: MakeUpKind; fibre?: FibreId; fibres?: YarnFormValues['makeUp']['fibres']; core?: YarnFormValues['makeUp']['core']; cover?: YarnFormValues['makeUp']['cover'] };
    colour: { state: ColourState; lab?: YarnFormValues['colour']['lab'] };
    pricePerKg: Num; recycledPct: Num;
  };
  return {
    name: e.name,
    supplierRef: e.supplierRef,
    count: e.count ?? { value: '', unit: y.countUnit },
    filaments: e.filaments ?? '',
    lustre: e.lustre ?? '',
    staple: e.staple,
    makeUp: {
      ...structuredClone(blank.makeUp),
      kind: e.makeUp.kind,
      ...(e.makeUp.fibre ? { fibre: e.makeUp.fibre } : {}),
      ...(e.makeUp.fibres ? { fibres: e.makeUp.fibres } : {}),
      ...(e.makeUp.core ? { core: e.makeUp.core } : {}),
      ...(e.makeUp.cover ? { cover: e.makeUp.cover } : {}),
    },
    colour: { state: e.colour.state, lab: e.colour.lab ?? { ...blank.colour.lab } },
    pricePerKg: e.pricePerKg ?? '',
    recycledPct: e.recycledPct ?? '',
  };
}

/** What goes to the API: a covered yarn's count follows from its core and cover, so it is left out. */
function toEntry(v: YarnFormValues): YarnEntry {
  const { count, ...rest } = v;
  return (v.makeUp.kind === 'covered' ? rest : { ...rest, count }) as unknown as YarnEntry;
}

const schemaResolver = zodResolver(yarnInputSchema) as unknown as Resolver<YarnFormValues, unknown, YarnInput>;
const resolver: Resolver<YarnFormValues, unknown, YarnInput> = (values, ctx, opts) =>
  schemaResolver(toEntry(values) as unknown as YarnFormValues, ctx, opts);

const elastomeric = fibreIds.filter((f) => fibres[f].kind === 'elastomeric');
const covers = fibreIds.filter((f) => fibres[f].kind !== 'elastomeric');
const toNum = (v: unknown) => {
  const n = typeof v === 'number' ? v : Number(String(v ?? '').replace(',', '.'));
  return Number.isFinite(n) ? n : NaN;
};

const useYarnForm = () => useFormContext<YarnFormValues>();

function FibreSelect({ name, label, options = fibreIds, disabled }: { name: string; label: string; options?: readonly FibreId[]; disabled?: boolean }) {
  return (
    <FormField name={name} label={label}>
      {(id, reg) => (
        <Select id={id} disabled={disabled} {...reg}>
          {options.map((f) => <option key={f} value={f}>{fibreLabel(f)}</option>)}
        </Select>
      )}
    </FormField>
  );
}

/** A field bound to the surrounding form by name, with its error from zod beside it. */
function FormField({ name, label, hint, className, children }: {
  name: string; label: string; hint?: string; className?: string;
  children: (id: string, reg: UseFormRegisterReturn & { 'aria-invalid': boolean }) => React.ReactNode;
}) {
  const { register, formState } = useYarnForm();
  const err = get(formState.errors, name) as { message?: string } | undefined;
  return (
    <Field label={label} error={err?.message} hint={hint} className={className}>
      {(id) => children(id, { ...register(name as 'name'), 'aria-invalid': !!err })}
    </Field>
  );
}

function SharesBar({ shares }: { shares: readonly YarnFibre[] }) {
  const palette = ['#22665a', '#3f4f8f', '#b7831f', '#b8453c', '#4a5157', '#7b8288'];
  const sorted = [...shares].sort((a, b) => b.share - a.share);
  return (
    <div className="space-y-2">
      <div className="flex h-2.5 overflow-hidden rounded-full bg-rule">
        {sorted.map((f, i) => <div key={f.fibre} style={{ width: `${f.share * 100}%`, background: palette[i % palette.length] }} />)}
      </div>
      <ul className="space-y-1 text-sm">
        {sorted.map((f, i) => (
          <li key={f.fibre} className="flex items-center gap-2">
            <span aria-hidden className="h-2.5 w-2.5 rounded-sm" style={{ background: palette[i % palette.length] }} />
            <span className="flex-1">{fibreLabel(f.fibre)}</span>
            <span className="figures">{formatPct(f.share, 2)}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}

function MakeUpEditor({ disabled }: { disabled: boolean }) {
  const { control, setValue, formState } = useYarnForm();
  const kind = useWatch({ control, name: 'makeUp.kind' });
  const blend = useFieldArray({ control, name: 'makeUp.fibres' });
  const blendRows = useWatch({ control, name: 'makeUp.fibres' });
  const sum = (blendRows ?? []).reduce((s, f) => s + (toNum(f.sharePct) || 0), 0);
  const blendErr = get(formState.errors, 'makeUp.fibres') as { message?: string; root?: { message?: string } } | undefined;
  const covered = useWatch({ control, name: ['makeUp.core', 'makeUp.cover'] });
  return (
    <div className="space-y-4">
      <div role="radiogroup" aria-label="Make-up" className="inline-flex rounded-md border border-rule-strong bg-paper p-0.5">
        {makeUpKinds.map((k) => (
          <button
            key={k}
            type="button"
            role="radio"
            aria-checked={kind === k}
            disabled={disabled}
            onClick={() => setValue('makeUp.kind', k, { shouldDirty: true })}
            className={`rounded px-3 py-1 text-sm font-medium ${kind === k ? 'bg-panel text-ink shadow-sm ring-1 ring-rule' : 'text-ink-soft hover:text-ink'}`}
          >
            {makeUpKindLabels[k]}
          </button>
        ))}
      </div>

      {kind === 'single' ? (
        <div className="max-w-xs"><FibreSelect name="makeUp.fibre" label="Fibre" disabled={disabled} /></div>
      ) : null}

      {kind === 'blend' ? (
        <div className="space-y-2">
          {blend.fields.map((f, i) => (
            <div key={f.id} className="flex items-end gap-2">
              <div className="w-56"><FibreSelect name={`makeUp.fibres.${i}.fibre`} label={i === 0 ? 'Fibre' : `Fibre ${i + 1}`} disabled={disabled} /></div>
              <FormField name={`makeUp.fibres.${i}.sharePct`} label="Share %" className="w-28">
                {(id, reg) => <Input id={id} inputMode="decimal" className="figures" disabled={disabled} {...reg} />}
              </FormField>
              <Button type="button" variant="ghost" size="sm" className="mb-1" disabled={disabled || blend.fields.length <= 2} onClick={() => blend.remove(i)} aria-label={`Remove fibre ${i + 1}`}>
                Remove
              </Button>
            </div>
          ))}
          <div className="flex items-center gap-3">
            <Button type="button" size="sm" disabled={disabled || blend.fields.length >= 6} onClick={() => blend.append({ fibre: 'elastane', sharePct: Math.max(0, Number((100 - sum).toFixed(2))) })}>
              Add fibre
            </Button>
            <span className={`figures text-sm ${Math.abs(sum - 100) <= 0.05 ? 'text-spruce-700' : 'text-madder-700'}`}>Total {Number(sum.toFixed(2))} %</span>
          </div>
          {blendErr?.message || blendErr?.root?.message ? <p role="alert" className="text-xs text-madder-700">{blendErr.message ?? blendErr.root?.message}</p> : null}
        </div>
      ) : null}

      {kind === 'covered' ? (
        <div className="grid gap-4 md:grid-cols-2">
          <fieldset className="space-y-3 rounded-md border border-rule bg-paper/50 p-3">
            <legend className="px-1 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">Core</legend>
            <FibreSelect name="makeUp.core.fibre" label="Core fibre" options={elastomeric} disabled={disabled} />
            <CountInput name="makeUp.core.count" label="Core count" disabled={disabled} />
            <FormField name="makeUp.core.draft" label="Draft" hint="Core length in the yarn ÷ length off the package, e.g. 3.2">
              {(id, reg) => <Input id={id} inputMode="decimal" className="figures w-28" disabled={disabled} {...reg} />}
            </FormField>
          </fieldset>
          <fieldset className="space-y-3 rounded-md border border-rule bg-paper/50 p-3">
            <legend className="px-1 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">Cover</legend>
            <FibreSelect name="makeUp.cover.fibre" label="Cover fibre" options={covers} disabled={disabled} />
            <CountInput name="makeUp.cover.count" label="Cover count" disabled={disabled} />
            <FormField name="makeUp.cover.takeUpPct" label="Take-up %" hint="Extra cover length from wrapping">
              {(id, reg) => <Input id={id} inputMode="decimal" className="figures w-28" disabled={disabled} {...reg} />}
            </FormField>
          </fieldset>
          <CoveredSummary core={covered[0]} cover={covered[1]} />
        </div>
      ) : null}
    </div>
  );
}

function coveredOf(core: YarnFormValues['makeUp']['core'], cover: YarnFormValues['makeUp']['cover']) {
  const coreDtex = typedDtex(core.count.value, core.count.unit);
  const coverDtex = typedDtex(cover.count.value, cover.count.unit);
  const draft = toNum(core.draft);
  const takeUp = toNum(cover.takeUpPct) / 100;
  if (coreDtex === null || coverDtex === null || !(draft >= 1) || !(takeUp >= 0)) return null;
  try {
    return coveredYarn({ fibre: core.fibre, dtex: coreDtex, draft }, { fibre: cover.fibre, dtex: coverDtex, takeUp });
  } catch {
    return null;
  }
}

function CoveredSummary({ core, cover }: { core: YarnFormValues['makeUp']['core']; cover: YarnFormValues['makeUp']['cover'] }) {
  const made = coveredOf(core, cover);
  return (
    <div className="rounded-md border border-spruce-100 bg-spruce-50/60 p-3 text-sm md:col-span-2" data-testid="covered-summary">
      {made ? (
        <div className="flex flex-wrap items-baseline gap-x-6 gap-y-1">
          <span>Covered yarn <span className="figures font-semibold">{made.dtex.toFixed(1)} dtex</span></span>
          <span className="text-ink-soft">core <span className="figures">{made.coreDtex.toFixed(2)} dtex</span> (÷ draft)</span>
          <span className="text-ink-soft">cover <span className="figures">{made.coverDtex.toFixed(2)} dtex</span> (× (1 + take-up))</span>
          <span className="text-ink-soft">{[...made.fibres].sort((a, b) => b.share - a.share).map((f) => `${formatPct(f.share, 1)} ${fibreName(f.fibre)}`).join(' · ')}</span>
        </div>
      ) : (
        <span className="text-ink-soft">Enter core and cover counts, the draft and the take-up to see the covered yarn’s count and shares.</span>
      )}
    </div>
  );
}

/** Live result of the form: count in every unit and the fibre shares, as the library will store them. */
function YarnSummary({ usedBy }: { usedBy: string[] }) {
  const { control } = useYarnForm();
  const v = useWatch({ control }) as YarnFormValues;
  let dtex: number | null = null;
  let shares: YarnFibre[] | null = null;
  if (v.makeUp?.kind === 'covered') {
    const made = coveredOf(v.makeUp.core, v.makeUp.cover);
    if (made) { dtex = made.dtex; shares = made.fibres; }
  } else if (v.count) {
    dtex = typedDtex(v.count.value, v.count.unit);
    if (v.makeUp?.kind === 'single') shares = [{ fibre: v.makeUp.fibre, share: 1 }];
    else if (v.makeUp?.kind === 'blend') {
      const sum = v.makeUp.fibres.reduce((s, f) => s + (toNum(f.sharePct) || 0), 0);
      if (sum > 0) shares = v.makeUp.fibres.map((f) => ({ fibre: f.fibre, share: (toNum(f.sharePct) || 0) / sum }));
    }
  }
  const lab = v.colour?.state !== 'dyeable' && v.colour?.lab ? { L: toNum(v.colour.lab.L), a: toNum(v.colour.lab.a), b: toNum(v.colour.lab.b) } : null;
  const labOk = lab && [lab.L, lab.a, lab.b].every(Number.isFinite);
  return (
    <div className="space-y-4">
      <Card title="As the library stores it">
        <dl className="space-y-3 text-sm">
          <div>
            <dt className="text-xs text-ink-faint">Linear density</dt>
            <dd className="figures text-xl font-semibold" data-testid="yarn-dtex">{dtex === null ? '—' : `${dtex.toFixed(1)} dtex`}</dd>
            {dtex !== null ? <dd className="figures text-xs text-ink-soft">{formatCount(dtex, 'den')} · {formatCount(dtex, 'tex', 2)} · {formatCount(dtex, 'Nm')} · {formatCount(dtex, 'Ne')}</dd> : null}
          </div>
          <div>
            <dt className="mb-1.5 text-xs text-ink-faint">Fibre shares by mass</dt>
            <dd>{shares ? <SharesBar shares={shares} /> : <span className="text-ink-faint">—</span>}</dd>
          </div>
          <div>
            <dt className="mb-1 text-xs text-ink-faint">Colour</dt>
            <dd className="flex items-center gap-2">
              {labOk ? (
                <>
                  <span aria-hidden className="h-6 w-10 rounded ring-1 ring-ink/15" style={{ background: labToSrgbHex(lab) }} />
                  <span className="figures text-xs text-ink-soft">L* {lab.L} a* {lab.a} b* {lab.b}{inSrgbGamut(lab) ? '' : ' · outside sRGB, preview clipped'}</span>
                </>
              ) : (
                <span className="text-ink-soft">Dyeable: coloured in the garment-dyeing run</span>
              )}
            </dd>
          </div>
        </dl>
      </Card>
      {usedBy.length > 0 ? (
        <Card title="Feeds these textures">
          <ul className="space-y-1 text-sm">{usedBy.map((n) => <li key={n}>{n}</li>)}</ul>
          <p className="mt-2 text-xs text-ink-faint">A yarn that feeds a texture cannot be archived; change the feeders first.</p>
        </Card>
      ) : null}
    </div>
  );
}

export function YarnForm({ yarn, canEdit, usedBy = [] }: { yarn?: LibraryYarn; canEdit: boolean; usedBy?: string[] }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [current, setCurrent] = useState(yarn);
  const [serverError, setServerError] = useState<{ message: string; stale: boolean } | null>(null);
  const [saved, setSaved] = useState(false);
  const form = useForm<YarnFormValues, unknown, YarnInput>({ resolver, defaultValues: toFormValues(yarn), mode: 'onTouched' });
  const { register, handleSubmit, formState, setError, reset, control } = form;
  const kind = useWatch({ control, name: 'makeUp.kind' });
  const colourState = useWatch({ control, name: 'colour.state' });
  const disabled = !canEdit;

  const onSubmit = handleSubmit(async () => {
    setServerError(null);
    setSaved(false);
    const entry = toEntry(form.getValues());
    try {
      if (current) {
        const { yarn: updated } = await api<{ yarn: LibraryYarn }>(`/api/library/yarns/${current.id}`, { method: 'PATCH', json: { ...entry, version: current.version } });
        setCurrent(updated);
        reset(toFormValues(updated));
        setSaved(true);
        await qc.invalidateQueries({ queryKey: ['library'] });
        router.refresh();
      } else {
        const { yarn: created } = await api<{ yarn: LibraryYarn }>('/api/library/yarns', { method: 'POST', json: entry });
        await qc.invalidateQueries({ queryKey: ['library'] });
        router.push(`/library/yarns/${created.id}`);
      }
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) setError(path as 'name', { message: msgs[0] });
        setServerError({ message: err.message, stale: err.status === 409 });
      } else setServerError({ message: 'Saving failed. Your entries are still here.', stale: false });
    }
  });

  const onArchive = async () => {
    if (!current || !window.confirm(`Archive ${current.name}? It leaves the library; textures that used it keep their history.`)) return;
    try {
      // The version this form last saved or loaded: archiving over a newer save gets 409.
      await api(`/api/library/yarns/${current.id}?version=${current.version}`, { method: 'DELETE' });
      await qc.invalidateQueries({ queryKey: ['library'] });
      router.push('/library?tab=yarns');
    } catch (err) {
      setServerError({
        message: err instanceof ApiError ? err.message : 'Archiving failed.',
        stale: err instanceof ApiError && err.status === 409 && 'currentVersion' in err.body,
      });
    }
  };

  const err = (path: string) => (get(formState.errors, path) as { message?: string } | undefined)?.message;

  return (
    <FormProvider {...form}>
      <form
        onSubmit={onSubmit}
        noValidate
        className={`grid grid-cols-1 gap-5 xl:grid-cols-[1fr_340px] ${disabled ? '[&_input:disabled]:bg-paper [&_input:disabled]:text-ink-soft [&_select:disabled]:bg-paper [&_select:disabled]:text-ink-soft' : ''}`}
      >
        <div className="space-y-5">
          {serverError ? (
            <Notice tone="error">
              {serverError.message}
              {serverError.stale ? <> <button type="button" className="font-medium underline" onClick={() => window.location.reload()}>Reload</button></> : null}
            </Notice>
          ) : null}
          {saved && !formState.isDirty ? <Notice tone="info">Saved.</Notice> : null}
          <Card title="Yarn as bought">
            <fieldset disabled={disabled} className="grid grid-cols-1 gap-4 md:grid-cols-6">
              <Field label="Name" error={err('name')} className="md:col-span-4">{(id) => <Input id={id} aria-invalid={!!err('name')} {...register('name')} />}</Field>
              <Field label="Supplier reference" error={err('supplierRef')} className="md:col-span-2">{(id) => <Input id={id} className="figures" {...register('supplierRef')} />}</Field>
              {kind !== 'covered' ? (
                <div className="md:col-span-3"><CountInput name="count" label="Count" disabled={disabled} /></div>
              ) : (
                <div className="space-y-1 md:col-span-3">
                  <div className="text-xs font-medium text-ink-soft">Count</div>
                  <p className="pt-2 text-sm text-ink-soft">Follows from the core and cover below.</p>
                </div>
              )}
              <Field label="Filaments" error={err('filaments')} hint="Blank for spun yarn" className="md:col-span-1">
                {(id) => <Input id={id} inputMode="numeric" className="figures" {...register('filaments')} />}
              </Field>
              <Field label="Lustre" error={err('lustre')} className="md:col-span-2">
                {(id) => (
                  <Select id={id} {...register('lustre')}>
                    <option value="">Not stated</option>
                    {lustres.map((l) => <option key={l} value={l}>{lustreLabels[l]}</option>)}
                  </Select>
                )}
              </Field>
              <label className="flex items-center gap-2 text-sm text-ink-soft md:col-span-6">
                <input type="checkbox" className="h-4 w-4 accent-spruce-600" {...register('staple')} />
                Spun from staple fibre (not filament)
              </label>
            </fieldset>
          </Card>

          <Card title="Fibre make-up">
            <fieldset disabled={disabled}><MakeUpEditor disabled={disabled} /></fieldset>
            {err('makeUp') ? <p role="alert" className="mt-2 text-xs text-madder-700">{err('makeUp')}</p> : null}
          </Card>

          <Card title="Colour and price">
            <fieldset disabled={disabled} className="grid grid-cols-1 gap-4 md:grid-cols-6">
              <Field label="Colour state" error={err('colour.state')} className="md:col-span-2">
                {(id) => (
                  <Select id={id} aria-invalid={!!err('colour.state')} {...register('colour.state')}>
                    {colourStates.map((s) => <option key={s} value={s}>{colourStateLabels[s]}</option>)}
                  </Select>
                )}
              </Field>
              {colourState !== 'dyeable' ? (
                <>
                  {(['L', 'a', 'b'] as const).map((c) => (
                    <Field key={c} label={`${c}*`} error={err(`colour.lab.${c}`)} className="md:col-span-1">
                      {(id) => <Input id={id} inputMode="decimal" className="figures" {...register(`colour.lab.${c}`)} />}
                    </Field>
                  ))}
                  <p className="self-end pb-2 text-xs text-ink-faint md:col-span-1">CIELAB D65/10°</p>
                </>
              ) : (
                <p className="self-end pb-2 text-sm text-ink-soft md:col-span-4">Takes its colour in the garment-dyeing run.</p>
              )}
              <Field label="Price per kg" error={err('pricePerKg')} className="md:col-span-2">{(id) => <Input id={id} inputMode="decimal" className="figures" {...register('pricePerKg')} />}</Field>
              <Field label="Recycled share %" error={err('recycledPct')} className="md:col-span-2">{(id) => <Input id={id} inputMode="decimal" className="figures" {...register('recycledPct')} />}</Field>
            </fieldset>
          </Card>

          {canEdit ? (
            <div className="flex items-center gap-2">
              <Button type="submit" variant="primary" disabled={formState.isSubmitting}>{formState.isSubmitting ? 'Saving…' : current ? 'Save yarn' : 'Add yarn'}</Button>
              <Button type="button" variant="ghost" onClick={() => router.push('/library?tab=yarns')}>Back to yarns</Button>
              {current ? <Button type="button" variant="danger" className="ml-auto" onClick={onArchive}>Archive yarn</Button> : null}
            </div>
          ) : (
            <p className="text-sm text-ink-soft">Your role reads the library; a designer or admin edits it.</p>
          )}
        </div>
        <YarnSummary usedBy={usedBy} />
      </form>
    </FormProvider>
  );
}

