'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import {
  createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnFiltersState, type SortingState,
} from '@tanstack/react-table';
import type { Style } from '@/lib/db/styles';
import { constructionLabels, garmentTypeLabels, styleStatuses, styleStatusLabels } from '@/lib/validations/style';
import { StatusBadge } from './status-badge';
import { useStyles } from './use-styles';
import { Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/card';

const col = createColumnHelper<Style>();

const columns = [
  col.accessor('code', { header: 'Code', cell: (c) => <span className="figures font-medium text-ink">{c.getValue()}</span> }),
  col.accessor('name', { header: 'Name' }),
  col.accessor('season', { header: 'Season', cell: (c) => <span className="figures">{c.getValue()}</span> }),
  col.accessor((s) => s.clientName ?? '—', { id: 'client', header: 'Client', filterFn: 'equalsString' }),
  col.accessor((s) => garmentTypeLabels[s.garmentType], { id: 'garment', header: 'Garment' }),
  col.accessor((s) => constructionLabels[s.construction], { id: 'construction', header: 'Construction' }),
  col.accessor('status', {
    header: 'Status',
    cell: (c) => <StatusBadge status={c.getValue()} />,
    sortingFn: (a, b) => styleStatuses.indexOf(a.original.status) - styleStatuses.indexOf(b.original.status),
    filterFn: 'equalsString',
  }),
  col.accessor('revision', { header: 'Rev.', cell: (c) => <span className="figures">R{c.getValue()}</span> }),
  col.accessor('updatedAt', {
    header: 'Updated',
    cell: (c) => <time className="figures text-ink-soft" dateTime={c.getValue()}>{c.getValue().slice(0, 10)}</time>,
  }),
];

export function StylesTable({ canCreate }: { canCreate: boolean }) {
  const router = useRouter();
  const { data, isLoading, error } = useStyles();
  const [globalFilter, setGlobalFilter] = useState('');
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const styles = useMemo(() => data ?? [], [data]);
  const clients = useMemo(() => [...new Set(styles.map((s) => s.clientName).filter((c): c is string => !!c))].sort(), [styles]);

  const table = useReactTable({
    data: styles,
    columns,
    state: { globalFilter, sorting, columnFilters },
    onGlobalFilterChange: setGlobalFilter,
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    globalFilterFn: 'includesString',
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  const setFilter = (id: string, value: string) =>
    setColumnFilters((f) => [...f.filter((x) => x.id !== id), ...(value ? [{ id, value }] : [])]);
  const filterValue = (id: string) => (columnFilters.find((f) => f.id === id)?.value as string) ?? '';

  return (
    <div className="rounded-[var(--radius-card)] border border-rule bg-panel">
      <div className="flex flex-wrap items-center gap-2 border-b border-rule p-3">
        <Input
          type="search"
          placeholder="Search code, name, season…"
          aria-label="Search styles"
          className="max-w-xs"
          value={globalFilter}
          onChange={(e) => setGlobalFilter(e.target.value)}
        />
        <Select aria-label="Filter by status" className="w-44" value={filterValue('status')} onChange={(e) => setFilter('status', e.target.value)}>
          <option value="">All statuses</option>
          {styleStatuses.map((s) => <option key={s} value={s}>{styleStatusLabels[s]}</option>)}
        </Select>
        <Select aria-label="Filter by client" className="w-48" value={filterValue('client')} onChange={(e) => setFilter('client', e.target.value)}>
          <option value="">All clients</option>
          {clients.map((c) => <option key={c} value={c}>{c}</option>)}
        </Select>
        <div className="ml-auto text-xs text-ink-faint figures">
          {table.getRowModel().rows.length} of {styles.length}
        </div>
      </div>
      {error ? (
        <div className="p-4"><Notice tone="error">Could not load styles: {error.message}</Notice></div>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper/60 text-xs text-ink-soft">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => {
                    const dir = h.column.getIsSorted();
                    return (
                      <th key={h.id} scope="col" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'} className="px-3 py-2 font-medium">
                        <button type="button" className="inline-flex items-center gap-1 hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden className="text-ink-faint">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : ''}</span>
                        </button>
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {isLoading ? (
                Array.from({ length: 5 }).map((_, i) => (
                  <tr key={i} className="border-b border-rule/70">
                    <td colSpan={columns.length} className="px-3 py-3"><div className="h-3 w-2/3 animate-pulse rounded bg-rule/70" /></td>
                  </tr>
                ))
              ) : table.getRowModel().rows.length === 0 ? (
                <tr>
                  <td colSpan={columns.length} className="px-3 py-12 text-center text-ink-soft">
                    {styles.length === 0 ? (
                      <>
                        <div className="font-medium text-ink">No styles yet</div>
                        <div className="mt-1 text-sm">{canCreate ? <Link className="text-spruce-600 underline" href="/styles/new">Create the first style</Link> : 'Nothing has been shared with you yet.'}</div>
                      </>
                    ) : (
                      'No style matches these filters.'
                    )}
                  </td>
                </tr>
              ) : (
                table.getRowModel().rows.map((row) => (
                  <tr
                    key={row.id}
                    className="cursor-pointer border-b border-rule/70 last:border-0 hover:bg-spruce-50/50"
                    onClick={() => router.push(`/styles/${row.original.id}`)}
                  >
                    {row.getVisibleCells().map((cell) => (
                      <td key={cell.id} className="px-3 py-2.5">
                        {cell.column.id === 'name' ? (
                          <Link href={`/styles/${row.original.id}`} className="font-medium text-ink hover:text-spruce-700" onClick={(e) => e.stopPropagation()}>
                            {row.original.name}
                          </Link>
                        ) : (
                          flexRender(cell.column.columnDef.cell, cell.getContext())
                        )}
                      </td>
                    ))}
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
