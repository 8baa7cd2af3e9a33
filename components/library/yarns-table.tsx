'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import {
  createColumnHelper, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnFiltersState, type FilterFn, type SortingState,
} from '@tanstack/react-table';
import { formatCount } from '@/lib/knit/count';
import type { FibreId } from '@/lib/knit/fibres';
import type { LibraryYarn } from '@/lib/db/yarns';
import { colourStateLabels, colourStates, lustreLabels, makeUpKindLabels } from '@/lib/validations/library';
import { Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/card';
import { DataTable } from './data-table';
import { fibreName, formatPct, sharesText, yarnSwatch } from './format';
import { useYarns } from './use-library';

const col = createColumnHelper<LibraryYarn>();

const hasFibre: FilterFn<LibraryYarn> = (row, _id, value: string) => row.original.fibres.some((f) => f.fibre === value && f.share > 0);

export function YarnSwatch({ yarn }: { yarn: LibraryYarn }) {
  const hex = yarnSwatch(yarn);
  return hex ? (
    <span aria-hidden className="inline-block h-3.5 w-3.5 shrink-0 rounded-full ring-1 ring-ink/15" style={{ background: hex }} />
  ) : (
    <span aria-hidden className="inline-block h-3.5 w-3.5 shrink-0 rounded-full border border-dashed border-rule-strong bg-panel" />
  );
}

const columns = [
  col.accessor('name', {
    header: 'Name',
    cell: (c) => (
      <Link href={`/library/yarns/${c.row.original.id}`} className="font-medium text-ink hover:text-spruce-700" onClick={(e) => e.stopPropagation()}>
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('supplierRef', { header: 'Supplier ref.', cell: (c) => <span className="figures text-ink-soft">{c.getValue() || '—'}</span> }),
  col.accessor('dtex', {
    header: 'Count',
    cell: (c) => (
      <span className="figures whitespace-nowrap">
        {c.getValue().toFixed(1)} <span className="text-ink-faint">dtex</span>
        {c.row.original.countUnit !== 'dtex' ? <span className="ml-2 text-ink-faint">{formatCount(c.getValue(), c.row.original.countUnit)}</span> : null}
      </span>
    ),
  }),
  col.accessor((y) => y.filaments ?? 0, {
    id: 'filaments',
    header: 'Filaments',
    cell: (c) => <span className="figures text-ink-soft">{c.row.original.filaments ? `f${c.row.original.filaments}` : c.row.original.staple ? 'spun' : '—'}</span>,
  }),
  col.accessor((y) => sharesText(y.fibres), {
    id: 'makeUp',
    header: 'Make-up',
    cell: (c) => (
      <div className="leading-tight">
        <div>{c.getValue().charAt(0).toUpperCase() + c.getValue().slice(1)}</div>
        {c.row.original.makeUp.kind !== 'single' ? <div className="text-xs text-ink-faint">{makeUpKindLabels[c.row.original.makeUp.kind]}</div> : null}
      </div>
    ),
  }),
  col.accessor((y) => y.fibres.map((f) => f.fibre).join(' '), { id: 'fibre', header: 'Fibre', filterFn: hasFibre, enableSorting: false }),
  col.accessor((y) => y.colour.state, {
    id: 'colour',
    header: 'Colour',
    filterFn: 'equalsString',
    cell: (c) => (
      <span className="inline-flex items-center gap-2 whitespace-nowrap">
        <YarnSwatch yarn={c.row.original} />
        {colourStateLabels[c.row.original.colour.state]}
      </span>
    ),
  }),
  col.accessor((y) => (y.lustre ? lustreLabels[y.lustre] : ''), { id: 'lustre', header: 'Lustre', cell: (c) => <span className="text-ink-soft">{c.getValue() || '—'}</span> }),
  col.accessor((y) => y.pricePerKg ?? -1, {
    id: 'price',
    header: 'Price / kg',
    cell: (c) => <span className="figures">{c.row.original.pricePerKg === null ? '—' : c.row.original.pricePerKg.toFixed(2)}</span>,
  }),
  col.accessor((y) => y.recycledShare ?? -1, {
    id: 'recycled',
    header: 'Recycled',
    cell: (c) => <span className="figures text-ink-soft">{c.row.original.recycledShare ? formatPct(c.row.original.recycledShare, 0) : '—'}</span>,
  }),
];

const numeric = new Set(['dtex', 'filaments', 'price', 'recycled']);

export function YarnsTable({ initial, canEdit }: { initial: LibraryYarn[]; canEdit: boolean }) {
  const router = useRouter();
  const { data, error } = useYarns(initial);
  const yarns = useMemo(() => data ?? [], [data]);
  const [globalFilter, setGlobalFilter] = useState('');
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const fibresPresent = useMemo(
    () => [...new Set(yarns.flatMap((y) => y.fibres.map((f) => f.fibre)))].sort((a, b) => fibreName(a).localeCompare(fibreName(b))) as FibreId[],
    [yarns],
  );

  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance stays inside this component
  const table = useReactTable({
    data: yarns,
    columns,
    state: { globalFilter, sorting, columnFilters, columnVisibility: { fibre: false } },
    onGlobalFilterChange: setGlobalFilter,
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    globalFilterFn: 'includesString',
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const setFilter = (id: string, value: string) => setColumnFilters((f) => [...f.filter((x) => x.id !== id), ...(value ? [{ id, value }] : [])]);
  const filterValue = (id: string) => (columnFilters.find((f) => f.id === id)?.value as string) ?? '';

  return (
    <div className="rounded-[var(--radius-card)] border border-rule bg-panel">
      <div className="flex flex-wrap items-center gap-2 border-b border-rule p-3">
        <Input type="search" placeholder="Search name, reference, fibre…" aria-label="Search yarns" className="max-w-xs" value={globalFilter} onChange={(e) => setGlobalFilter(e.target.value)} />
        <Select aria-label="Filter by fibre" className="w-48" value={filterValue('fibre')} onChange={(e) => setFilter('fibre', e.target.value)}>
          <option value="">All fibres</option>
          {fibresPresent.map((f) => <option key={f} value={f}>{fibreName(f)}</option>)}
        </Select>
        <Select aria-label="Filter by colour state" className="w-44" value={filterValue('colour')} onChange={(e) => setFilter('colour', e.target.value)}>
          <option value="">All colour states</option>
          {colourStates.map((s) => <option key={s} value={s}>{colourStateLabels[s]}</option>)}
        </Select>
        <div className="figures ml-auto text-xs text-ink-faint">{table.getRowModel().rows.length} of {yarns.length}</div>
      </div>
      {error ? (
        <div className="p-4"><Notice tone="error">Could not load the yarns: {error.message}</Notice></div>
      ) : (
        <DataTable
          table={table}
          onOpen={(y) => router.push(`/library/yarns/${y.id}`)}
          cellClass={(id) => (numeric.has(id) ? 'text-right' : '')}
          empty={
            yarns.length === 0 ? (
              <>
                <div className="font-medium text-ink">No yarns in the library yet</div>
                {canEdit ? <div className="mt-1 text-sm"><Link className="text-spruce-600 underline" href="/library/yarns/new">Add the first yarn</Link></div> : null}
              </>
            ) : (
              'No yarn matches these filters.'
            )
          }
        />
      )}
    </div>
  );
}
