'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import {
  createColumnHelper, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnFiltersState, type SortingState,
} from '@tanstack/react-table';
import { arealDensity, textureYarnIds } from '@/lib/knit/texture';
import type { LibraryTexture } from '@/lib/db/textures';
import type { LibraryYarn } from '@/lib/db/yarns';
import { textureFamilies, textureFamilyLabels, textureFunctionLabels, textureFunctions } from '@/lib/validations/library';
import { Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/card';
import { ChartThumbnail } from './chart-thumbnail';
import { DataTable } from './data-table';
import { FunctionBadge } from './function-badge';
import { useTextures, useYarns } from './use-library';

interface Row {
  texture: LibraryTexture;
  gsm: number | null;
  yarnNames: string[];
}

const col = createColumnHelper<Row>();

const columns = [
  col.display({ id: 'chart', header: 'Chart', cell: (c) => <ChartThumbnail cells={c.row.original.texture.repeat.cells} /> }),
  col.accessor((r) => r.texture.name, {
    id: 'name',
    header: 'Name',
    cell: (c) => (
      <div className="leading-tight">
        <Link href={`/library/textures/${c.row.original.texture.id}`} className="font-medium text-ink hover:text-spruce-700" onClick={(e) => e.stopPropagation()}>
          {c.getValue()}
        </Link>
        <div className="mt-0.5 max-w-md truncate text-xs text-ink-faint">{c.row.original.yarnNames.join(' · ')}</div>
      </div>
    ),
  }),
  col.accessor((r) => r.texture.family, { id: 'family', header: 'Family', filterFn: 'equalsString', cell: (c) => textureFamilyLabels[c.getValue()] }),
  col.accessor((r) => r.texture.function ?? '', {
    id: 'function',
    header: 'Function',
    filterFn: 'equalsString',
    cell: (c) => <FunctionBadge fn={c.row.original.texture.function} />,
  }),
  col.accessor((r) => r.texture.repeat.needles * r.texture.repeat.courses, {
    id: 'repeat',
    header: 'Repeat',
    cell: (c) => (
      <span className="figures whitespace-nowrap">
        {c.row.original.texture.repeat.needles} × {c.row.original.texture.repeat.courses}
      </span>
    ),
  }),
  col.accessor((r) => r.texture.density.walesPerCm * r.texture.density.coursesPerCm, {
    id: 'density',
    header: 'Wales × courses / cm',
    cell: (c) => (
      <span className="figures whitespace-nowrap">
        {c.row.original.texture.density.walesPerCm} × {c.row.original.texture.density.coursesPerCm}
      </span>
    ),
  }),
  col.accessor((r) => r.texture.loopMm.knit, {
    id: 'loops',
    header: 'Loop k / t mm',
    cell: (c) => (
      <span className="figures whitespace-nowrap">
        {c.row.original.texture.loopMm.knit.toFixed(2)} / {c.row.original.texture.loopMm.tuck.toFixed(2)}
      </span>
    ),
  }),
  col.accessor((r) => r.gsm ?? -1, {
    id: 'gsm',
    header: 'g/m²',
    cell: (c) => <span className="figures font-medium">{c.row.original.gsm === null ? '—' : c.row.original.gsm.toFixed(0)}</span>,
  }),
];

const numeric = new Set(['repeat', 'density', 'loops', 'gsm']);

export function TexturesTable({ initialTextures, initialYarns, canEdit }: { initialTextures: LibraryTexture[]; initialYarns: LibraryYarn[]; canEdit: boolean }) {
  const router = useRouter();
  const textures = useTextures(initialTextures);
  const yarns = useYarns(initialYarns);
  const [globalFilter, setGlobalFilter] = useState('');
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);

  const rows = useMemo<Row[]>(() => {
    const byId = new Map((yarns.data ?? []).map((y) => [y.id, y]));
    return (textures.data ?? []).map((t) => {
      const ids = textureYarnIds(t);
      let gsm: number | null = null;
      if (ids.every((id) => byId.has(id))) {
        try {
          gsm = arealDensity(t, byId, t.gauge);
        } catch {
          gsm = null;
        }
      }
      return { texture: t, gsm, yarnNames: ids.map((id) => byId.get(id)?.name ?? 'unknown yarn') };
    });
  }, [textures.data, yarns.data]);

  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance stays inside this component
  const table = useReactTable({
    data: rows,
    columns,
    state: { globalFilter, sorting, columnFilters },
    onGlobalFilterChange: setGlobalFilter,
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    globalFilterFn: (row, _id, value: string) => {
      const q = value.toLowerCase();
      const t = row.original.texture;
      return [t.name, textureFamilyLabels[t.family], t.function ? textureFunctionLabels[t.function] : 'general', ...row.original.yarnNames, t.notes ?? '']
        .some((s) => s.toLowerCase().includes(q));
    },
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const setFilter = (id: string, value: string) => setColumnFilters((f) => [...f.filter((x) => x.id !== id), ...(value ? [{ id, value }] : [])]);
  const filterValue = (id: string) => (columnFilters.find((f) => f.id === id)?.value as string) ?? '';
  const error = textures.error ?? yarns.error;

  return (
    <div className="rounded-[var(--radius-card)] border border-rule bg-panel">
      <div className="flex flex-wrap items-center gap-2 border-b border-rule p-3">
        <Input type="search" placeholder="Search name, family, yarn…" aria-label="Search textures" className="max-w-xs" value={globalFilter} onChange={(e) => setGlobalFilter(e.target.value)} />
        <Select aria-label="Filter by family" className="w-44" value={filterValue('family')} onChange={(e) => setFilter('family', e.target.value)}>
          <option value="">All families</option>
          {textureFamilies.map((f) => <option key={f} value={f}>{textureFamilyLabels[f]}</option>)}
        </Select>
        <Select aria-label="Filter by function" className="w-44" value={filterValue('function')} onChange={(e) => setFilter('function', e.target.value)}>
          <option value="">All functions</option>
          {textureFunctions.map((f) => <option key={f} value={f}>{textureFunctionLabels[f]}</option>)}
        </Select>
        <div className="figures ml-auto text-xs text-ink-faint">{table.getRowModel().rows.length} of {rows.length} · g/m² estimated at each texture’s gauge</div>
      </div>
      {error ? (
        <div className="p-4"><Notice tone="error">Could not load the library: {error.message}</Notice></div>
      ) : (
        <DataTable
          table={table}
          onOpen={(r) => router.push(`/library/textures/${r.texture.id}`)}
          cellClass={(id) => (numeric.has(id) ? 'text-right' : id === 'chart' ? 'w-16' : '')}
          empty={
            rows.length === 0 ? (
              <>
                <div className="font-medium text-ink">No textures in the library yet</div>
                {canEdit ? <div className="mt-1 text-sm"><Link className="text-spruce-600 underline" href="/library/textures/new">Draw the first texture</Link></div> : null}
              </>
            ) : (
              'No texture matches these filters.'
            )
          }
        />
      )}
    </div>
  );
}
