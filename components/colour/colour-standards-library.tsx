'use client';

import { useMemo, useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import {
  createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type SortingState,
} from '@tanstack/react-table';
import type { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import { inSrgbGamut, labToSrgbHex } from '@/lib/colour/convert';
import type { Lab } from '@/lib/colour/lab';
import { toleranceLabel } from '@/lib/colour/difference';
import type { ColourStandard } from '@/lib/db/colour-standards';
import {
  colourStandardInputSchema, standardSourceLabels, standardSources, type ColourStandardInput,
} from '@/lib/validations/colour';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { GamutNote, Swatch, fmtLab } from './swatch';
import { colourKeys } from './use-colour';

type FormIn = z.input<typeof colourStandardInputSchema>;

const shortSource: Record<ColourStandard['source'], string> = { measured: 'Measured', 'client-agreed': 'Client-agreed', digital: 'Digital' };

const blank: FormIn = {
  name: '',
  lab: { L: '', a: '', b: '' } as unknown as Lab,
  source: 'measured',
  notes: '',
  tolerance: { formula: 'cmc', l: 2, c: 1, max: 1 },
};

const toForm = (s: ColourStandard): FormIn => ({ name: s.name, lab: s.lab, source: s.source, notes: s.notes, tolerance: s.tolerance });

const col = createColumnHelper<ColourStandard>();
const columns = [
  col.accessor('name', {
    header: 'Standard',
    cell: ({ row: { original: s } }) => (
      <span className="flex items-center gap-2.5">
        <Swatch lab={s.lab} label={s.name} />
        <span className="font-medium">{s.name}</span>
      </span>
    ),
  }),
  col.accessor((s) => s.lab.L, { id: 'lab', header: 'L* / a* / b*', cell: (c) => <span className="figures text-xs">{fmtLab(c.row.original.lab)}</span> }),
  col.accessor((s) => labToSrgbHex(s.lab), {
    id: 'hex',
    header: 'Screen preview',
    cell: (c) => (
      <span className="leading-tight">
        <span className="figures block text-xs text-ink-soft">{c.getValue()}</span>
        {inSrgbGamut(c.row.original.lab) ? null : <span className="block text-2xs text-ochre-700">outside sRGB, clipped</span>}
      </span>
    ),
  }),
  col.accessor((s) => shortSource[s.source], { id: 'source', header: 'Source' }),
  col.accessor((s) => s.tolerance.max, { id: 'tolerance', header: 'Accepts', cell: (c) => <span className="figures text-xs">{toleranceLabel(c.row.original.tolerance)}</span> }),
  col.accessor('updatedAt', { header: 'Updated', cell: (c) => <time className="figures text-xs text-ink-soft" dateTime={c.getValue()}>{c.getValue().slice(0, 10)}</time> }),
];

/** The studio's colour standards: a table, and a form to add or edit one (colour lead, admin). */
export function ColourStandardsLibrary({ initial, canEdit }: { initial: ColourStandard[]; canEdit: boolean }) {
  const standards = useQuery({
    queryKey: colourKeys.standards,
    queryFn: () => api<{ standards: ColourStandard[] }>('/api/library/colour-standards').then((r) => r.standards),
    initialData: initial,
  });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [filter, setFilter] = useState('');
  const [editing, setEditing] = useState<ColourStandard | 'new' | null>(null);
  const data = useMemo(() => standards.data ?? [], [standards.data]);
  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance stays inside this component
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    globalFilterFn: 'includesString',
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,1fr)_400px]">
      <div className="rounded-[var(--radius-card)] border border-rule bg-panel">
        <div className="flex items-center gap-2 border-b border-rule p-3">
          <Input type="search" aria-label="Search colour standards" placeholder="Search names…" className="max-w-xs" value={filter} onChange={(e) => setFilter(e.target.value)} />
          <span className="figures ml-auto text-xs text-ink-faint">{table.getRowModel().rows.length} of {data.length}</span>
          {canEdit ? <Button variant="primary" onClick={() => setEditing('new')}>New standard</Button> : null}
        </div>
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper/60 text-xs text-ink-soft">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => (
                    <th key={h.id} scope="col" className="px-3 py-2 font-medium">
                      <button type="button" className="hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden className="ml-1 text-ink-faint">{h.column.getIsSorted() === 'asc' ? '▲' : h.column.getIsSorted() === 'desc' ? '▼' : ''}</span>
                      </button>
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.length === 0 ? (
                <tr><td colSpan={columns.length} className="px-3 py-10 text-center text-ink-soft">{data.length ? 'No standard matches.' : 'No colour standards yet.'}</td></tr>
              ) : (
                table.getRowModel().rows.map((row) => (
                  <tr
                    key={row.id}
                    className={`border-b border-rule/70 ${canEdit ? 'cursor-pointer hover:bg-paper/70' : ''} ${editing !== 'new' && editing?.id === row.original.id ? 'bg-spruce-50/60' : ''}`}
                    onClick={canEdit ? () => setEditing(row.original) : undefined}
                  >
                    {row.getVisibleCells().map((cell) => <td key={cell.id} className="px-3 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>)}
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      </div>
      {canEdit && editing ? (
        <StandardForm key={editing === 'new' ? 'new' : `${editing.id}-${editing.version}`} standard={editing === 'new' ? null : editing} onDone={() => setEditing(null)} />
      ) : (
        <Card title="About colour standards">
          <p className="text-sm text-ink-soft">
            CIELAB values under D65 with the 10° observer, as the studio’s instrument reports them. Lab dips for a target that uses a standard
            are judged by its tolerance; the default is CMC(2:1) ≤ 1.00. The screen preview is only a guide: colours outside sRGB are shown
            with less chroma.
          </p>
        </Card>
      )}
    </div>
  );
}

function StandardForm({ standard, onDone }: { standard: ColourStandard | null; onDone: () => void }) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<FormIn, unknown, ColourStandardInput>({
    resolver: zodResolver(colourStandardInputSchema) as Resolver<FormIn, unknown, ColourStandardInput>,
    defaultValues: standard ? toForm(standard) : blank,
  });
  const { register, handleSubmit, formState, setError, control, setValue } = form;
  const lab = useWatch({ control, name: 'lab' }) as Record<string, unknown>;
  const formula = useWatch({ control, name: 'tolerance.formula' });
  const n = (v: unknown) => (typeof v === 'number' ? v : typeof v === 'string' && v.trim() ? Number(v.replace(',', '.')) : NaN);
  const live = [n(lab?.L), n(lab?.a), n(lab?.b)].every(Number.isFinite) ? { L: n(lab?.L), a: n(lab?.a), b: n(lab?.b) } : null;

  const err = (path: string): string | undefined => {
    let node: unknown = formState.errors;
    for (const part of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
    return (node as { message?: string } | undefined)?.message;
  };

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    try {
      if (standard) {
        await api(`/api/library/colour-standards/${standard.id}`, { method: 'PATCH', json: { version: standard.version, ...values } });
      } else {
        await api('/api/library/colour-standards', { method: 'POST', json: values });
      }
      await qc.invalidateQueries({ queryKey: colourKeys.standards });
      onDone();
    } catch (e) {
      if (e instanceof ApiError) {
        for (const [path, msgs] of Object.entries(e.fieldErrors)) setError(path as never, { message: msgs[0] });
        setServerError(e.status === 409 ? `${e.message}` : e.message);
      } else setServerError('Saving failed. Your entries are still here; try again.');
    }
  });

  const archive = async () => {
    if (!standard) return;
    try {
      await api(`/api/library/colour-standards/${standard.id}`, { method: 'DELETE' });
      await qc.invalidateQueries({ queryKey: colourKeys.standards });
      onDone();
    } catch (e) {
      setServerError(e instanceof ApiError ? e.message : 'That did not work.');
    }
  };

  return (
    <Card title={standard ? `Edit ${standard.name}` : 'New colour standard'}>
      <form onSubmit={onSubmit} noValidate className="space-y-3" aria-label={standard ? 'Edit colour standard' : 'New colour standard'}>
        {serverError ? <Notice tone="error">{serverError}</Notice> : null}
        <div className="flex items-start gap-3">
          {live ? <Swatch lab={live} size="lg" label="Standard" /> : <span className="inline-flex h-16 w-24 items-center justify-center rounded-[5px] border border-dashed border-rule-strong text-2xs text-ink-faint">enter L* a* b*</span>}
          <div className="min-w-0 flex-1">
            <Field label="Name" error={err('name')}>{(id) => <Input id={id} {...register('name')} aria-invalid={!!err('name')} />}</Field>
          </div>
        </div>
        {live ? <GamutNote lab={live} /> : null}
        <div className="grid grid-cols-3 gap-2">
          {(['L', 'a', 'b'] as const).map((k) => (
            <Field key={k} label={`${k}*`} error={err(`lab.${k}`)}>
              {(id) => <Input id={id} inputMode="decimal" className="figures" {...register(`lab.${k}`)} aria-invalid={!!err(`lab.${k}`)} />}
            </Field>
          ))}
        </div>
        <Field label="Source" error={err('source')}>
          {(id) => (
            <Select id={id} {...register('source')}>
              {standardSources.map((s) => <option key={s} value={s}>{standardSourceLabels[s]}</option>)}
            </Select>
          )}
        </Field>
        <fieldset className="rounded-md border border-rule p-2.5">
          <legend className="px-1 text-xs font-medium text-ink-soft">Lab-dip tolerance</legend>
          <div className="grid grid-cols-[1fr_4rem_4rem_5rem] items-end gap-2">
            <Field label="Formula">
              {(id) => (
                <Select
                  id={id}
                  value={formula ?? 'cmc'}
                  onChange={(e) =>
                    setValue('tolerance', e.target.value === 'de2000' ? { formula: 'de2000', max: 1 } : { formula: 'cmc', l: 2, c: 1, max: 1 }, { shouldDirty: true })
                  }
                >
                  <option value="cmc">CMC(l:c)</option>
                  <option value="de2000">ΔE00</option>
                </Select>
              )}
            </Field>
            {formula !== 'de2000' ? (
              <>
                <Field label="l" error={err('tolerance.l')}>{(id) => <Input id={id} inputMode="decimal" className="figures" {...register('tolerance.l' as never)} />}</Field>
                <Field label="c" error={err('tolerance.c')}>{(id) => <Input id={id} inputMode="decimal" className="figures" {...register('tolerance.c' as never)} />}</Field>
              </>
            ) : (
              <><span /><span /></>
            )}
            <Field label="Max ΔE" error={err('tolerance.max')}>{(id) => <Input id={id} inputMode="decimal" className="figures" {...register('tolerance.max')} aria-invalid={!!err('tolerance.max')} />}</Field>
          </div>
        </fieldset>
        <Field label="Notes" error={err('notes')}>{(id) => <Input id={id} {...register('notes')} placeholder="The physical standard, who agreed it, when" />}</Field>
        <div className="flex items-center gap-2 pt-1">
          <Button type="submit" variant="primary" disabled={formState.isSubmitting}>{standard ? 'Save standard' : 'Add standard'}</Button>
          <Button type="button" variant="ghost" onClick={onDone}>Cancel</Button>
          {standard ? <Button type="button" variant="danger" className="ml-auto" onClick={archive}>Archive</Button> : null}
        </div>
      </form>
    </Card>
  );
}
