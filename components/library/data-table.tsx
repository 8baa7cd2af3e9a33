'use client';

import { flexRender, type Table } from '@tanstack/react-table';

/** The library's table body: sortable headers, a calm empty state, rows that open the record. */
export function DataTable<T>({ table, empty, onOpen, cellClass }: {
  table: Table<T>;
  empty: React.ReactNode;
  onOpen: (row: T) => void;
  cellClass?: (columnId: string) => string;
}) {
  const rows = table.getRowModel().rows;
  const colCount = table.getVisibleLeafColumns().length;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-rule bg-paper/60 text-xs text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const dir = h.column.getIsSorted();
                const align = cellClass?.(h.column.id) ?? '';
                return (
                  <th key={h.id} scope="col" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'} className={`px-3 py-2 font-medium ${align}`}>
                    {h.column.getCanSort() ? (
                      <button type="button" className="inline-flex items-center gap-1 hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden className="text-ink-faint">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : ''}</span>
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={colCount} className="px-3 py-12 text-center text-ink-soft">{empty}</td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} className="cursor-pointer border-b border-rule/70 last:border-0 hover:bg-spruce-50/50" onClick={() => onOpen(row.original)}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-3 py-2 align-middle ${cellClass?.(cell.column.id) ?? ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
