'use client';

import { useMemo, useRef, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { splitClipboardGrid } from '@/lib/fit/paste';

export type CellTone = 'base' | 'graded' | 'override' | 'derived' | 'invalid' | 'plain';

export interface GridCell {
  /** What the cell shows. */
  text: string;
  /** What an edit starts from (defaults to `text`). */
  editText?: string;
  editable: boolean;
  tone?: CellTone;
  /** Accessible name, e.g. "Chest half-width, M". */
  label: string;
  title?: string;
}

export interface GridColumn {
  id: string;
  header: React.ReactNode;
  title?: string;
  /** Marks the column (the base size). */
  accent?: boolean;
}

export interface GridRow {
  id: string;
  header: React.ReactNode;
  cells: Record<string, GridCell | undefined>;
  /** Shown after the last column (row actions). */
  trailing?: React.ReactNode;
  muted?: boolean;
}

const tones: Record<CellTone, string> = {
  base: 'bg-spruce-50/70 font-semibold text-ink',
  graded: 'text-ink-soft',
  override: 'font-semibold text-indigo-thread',
  derived: 'text-ink-faint italic',
  invalid: 'bg-madder-50 text-madder-700',
  plain: 'text-ink',
};

const col = createColumnHelper<GridRow>();

/**
 * An editable grid of numbers, spreadsheet-like: arrows move, Enter or typing edits, Enter and
 * Tab commit and move on, Escape cancels, Delete clears, and a block pasted from a spreadsheet
 * fills the cells from the active one. The parent owns the values: it gets the raw text of each
 * commit (null for a clear) and turns it into its own change.
 */
export function SpecGrid({
  label, rowHeader, columns, rows, onCommit, onPaste, readOnly = false, testId,
}: {
  label: string;
  rowHeader: string;
  columns: GridColumn[];
  rows: GridRow[];
  onCommit: (rowId: string, colId: string, raw: string | null) => void;
  onPaste?: (rowId: string, colId: string, grid: string[][]) => void;
  readOnly?: boolean;
  testId?: string;
}) {
  const [active, setActive] = useState<{ r: number; c: number }>({ r: 0, c: 0 });
  const [editing, setEditingState] = useState<{ r: number; c: number; text: string } | null>(null);
  // The open edit as of the last event, for blur and key handlers that run before a re-render.
  const editingRef = useRef<{ r: number; c: number; text: string } | null>(null);
  const setEditing = (v: { r: number; c: number; text: string } | null) => {
    editingRef.current = v;
    setEditingState(v);
  };
  const cellRefs = useRef(new Map<string, HTMLTableCellElement>());

  const cellAt = (r: number, c: number) => {
    const row = rows[r];
    const column = columns[c];
    return row && column ? row.cells[column.id] : undefined;
  };

  const focusCell = (r: number, c: number) => {
    const rr = Math.max(0, Math.min(rows.length - 1, r));
    const cc = Math.max(0, Math.min(columns.length - 1, c));
    setActive({ r: rr, c: cc });
    requestAnimationFrame(() => cellRefs.current.get(`${rr}:${cc}`)?.focus());
  };

  const startEdit = (r: number, c: number, text?: string) => {
    const cell = cellAt(r, c);
    if (readOnly || !cell?.editable) return;
    setEditing({ r, c, text: text ?? cell.editText ?? cell.text });
  };

  const commit = (move?: { dr: number; dc: number }) => {
    const e = editingRef.current;
    if (!e) return;
    setEditing(null);
    const row = rows[e.r];
    const column = columns[e.c];
    const cell = cellAt(e.r, e.c);
    if (row && column && cell && e.text.trim() !== (cell.editText ?? cell.text).trim()) {
      onCommit(row.id, column.id, e.text.trim() === '' ? null : e.text);
    }
    if (move) focusCell(e.r + move.dr, e.c + move.dc);
    else focusCell(e.r, e.c);
  };

  const cancel = () => {
    const e = editingRef.current;
    setEditing(null);
    if (e) focusCell(e.r, e.c);
  };

  const onCellKey = (ev: React.KeyboardEvent, r: number, c: number) => {
    if (editing) return;
    const moves: Record<string, [number, number]> = { ArrowUp: [-1, 0], ArrowDown: [1, 0], ArrowLeft: [0, -1], ArrowRight: [0, 1] };
    const m = moves[ev.key];
    if (m) { ev.preventDefault(); focusCell(r + m[0], c + m[1]); return; }
    if (ev.key === 'Tab') {
      const next = c + (ev.shiftKey ? -1 : 1);
      if (next >= 0 && next < columns.length) { ev.preventDefault(); focusCell(r, next); }
      return;
    }
    if (ev.key === 'Home') { ev.preventDefault(); focusCell(r, 0); return; }
    if (ev.key === 'End') { ev.preventDefault(); focusCell(r, columns.length - 1); return; }
    if (ev.key === 'Enter' || ev.key === 'F2') { ev.preventDefault(); startEdit(r, c); return; }
    const cell = cellAt(r, c);
    if ((ev.key === 'Delete' || ev.key === 'Backspace') && cell?.editable && !readOnly) {
      ev.preventDefault();
      const row = rows[r];
      const column = columns[c];
      if (row && column) onCommit(row.id, column.id, null);
      return;
    }
    if (ev.key.length === 1 && !ev.ctrlKey && !ev.metaKey && !ev.altKey && cell?.editable && !readOnly) {
      ev.preventDefault();
      startEdit(r, c, ev.key);
    }
  };

  const onInputKey = (ev: React.KeyboardEvent<HTMLInputElement>) => {
    if (ev.key === 'Enter') { ev.preventDefault(); commit({ dr: ev.shiftKey ? -1 : 1, dc: 0 }); }
    else if (ev.key === 'Tab') { ev.preventDefault(); commit({ dr: 0, dc: ev.shiftKey ? -1 : 1 }); }
    else if (ev.key === 'Escape') { ev.preventDefault(); cancel(); }
    else if (ev.key === 'ArrowUp' || ev.key === 'ArrowDown') { ev.preventDefault(); commit({ dr: ev.key === 'ArrowUp' ? -1 : 1, dc: 0 }); }
  };

  const onGridPaste = (ev: React.ClipboardEvent) => {
    if (readOnly || !onPaste) return;
    const text = ev.clipboardData.getData('text/plain');
    // Inside an open cell a plain value pastes as text; a block always fills the grid.
    if (editing && !/[\t\n]/.test(text.replace(/\n$/, ''))) return;
    ev.preventDefault();
    const origin = editing ?? active;
    if (editing) setEditing(null);
    const row = rows[origin.r];
    const column = columns[origin.c];
    if (row && column) onPaste(row.id, column.id, splitClipboardGrid(text));
    focusCell(origin.r, origin.c);
  };

  const onGridCopy = (ev: React.ClipboardEvent) => {
    if (editing) return;
    const cell = cellAt(active.r, active.c);
    if (!cell) return;
    ev.preventDefault();
    ev.clipboardData.setData('text/plain', cell.editText ?? cell.text);
  };

  const columnDefs = useMemo<ColumnDef<GridRow, unknown>[]>(
    () => [
      col.display({ id: '__row', header: rowHeader }),
      ...columns.map((c) => col.display({ id: c.id, header: () => c.header })),
      col.display({ id: '__trailing', header: '' }),
    ],
    [columns, rowHeader],
  );

  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance stays inside this component
  const table = useReactTable({ data: rows, columns: columnDefs, getCoreRowModel: getCoreRowModel(), getRowId: (r) => r.id });

  return (
    <div className="overflow-x-auto" onPaste={onGridPaste} onCopy={onGridCopy} data-testid={testId}>
      <table role="grid" aria-label={label} className="w-full border-separate border-spacing-0 text-sm">
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const column = columns.find((c) => c.id === h.column.id);
                const isRow = h.column.id === '__row';
                return (
                  <th
                    key={h.id}
                    scope="col"
                    title={column?.title}
                    className={`sticky top-0 border-b border-rule-strong bg-paper px-2 py-1.5 text-xs font-medium text-ink-soft ${isRow ? 'min-w-44 text-left' : 'text-right'} ${column?.accent ? 'bg-spruce-50 text-spruce-700' : ''}`}
                  >
                    {flexRender(h.column.columnDef.header, h.getContext())}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row, r) => (
            <tr key={row.id} className={row.original.muted ? 'bg-paper/50' : ''}>
              {row.getVisibleCells().map((cell) => {
                const id = cell.column.id;
                if (id === '__row') {
                  return (
                    <th key={cell.id} scope="row" className="border-b border-rule px-2 py-1 text-left text-[13px] font-medium text-ink">
                      {row.original.header}
                    </th>
                  );
                }
                if (id === '__trailing') {
                  return <td key={cell.id} className="w-8 border-b border-rule px-1 text-right">{row.original.trailing}</td>;
                }
                const c = columns.findIndex((x) => x.id === id);
                const model = row.original.cells[id];
                const isActive = active.r === r && active.c === c;
                const isEditing = editing?.r === r && editing.c === c;
                const column = columns[c];
                return (
                  <td
                    key={cell.id}
                    role="gridcell"
                    aria-label={model?.label}
                    aria-readonly={!model?.editable || readOnly || undefined}
                    title={model?.title}
                    tabIndex={isActive ? 0 : -1}
                    ref={(el) => { if (el) cellRefs.current.set(`${r}:${c}`, el); else cellRefs.current.delete(`${r}:${c}`); }}
                    onFocus={() => setActive({ r, c })}
                    onKeyDown={(ev) => onCellKey(ev, r, c)}
                    onDoubleClick={() => startEdit(r, c)}
                    className={`figures relative h-8 min-w-[4.75rem] border-b border-l border-rule px-2 text-right tabular-nums outline-none ${model ? tones[model.tone ?? 'plain'] : ''} ${column?.accent && model?.tone !== 'invalid' ? 'bg-spruce-50/60' : ''} focus:shadow-[inset_0_0_0_2px_var(--color-spruce-500)] ${model?.editable && !readOnly ? 'cursor-cell' : ''}`}
                  >
                    {isEditing ? (
                      <input
                        autoFocus
                        aria-label={model?.label}
                        value={editing.text}
                        onChange={(e) => setEditing({ ...editing, text: e.target.value })}
                        onKeyDown={onInputKey}
                        onBlur={() => commit()}
                        onFocus={(e) => { if (e.target.value.length > 1) e.target.select(); }}
                        className="figures absolute inset-0 w-full bg-panel px-2 text-right text-ink shadow-[inset_0_0_0_2px_var(--color-spruce-600)] outline-none"
                      />
                    ) : (
                      <>
                        {model?.tone === 'override' ? <span aria-hidden className="absolute left-1 top-1 h-1.5 w-1.5 rounded-full bg-indigo-thread" /> : null}
                        {model?.text ?? ''}
                      </>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
