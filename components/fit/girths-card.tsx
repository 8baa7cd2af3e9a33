'use client';

import { girthLabels, type GirthKey } from '@/lib/fit/points';
import type { SizeSpec } from '@/lib/fit/spec';
import { formatLength, type LengthUnit } from '@/lib/fit/units';
import { Card } from '@/components/ui/card';
import { SpecGrid, type GridColumn, type GridRow } from './spec-grid';
import { sizeCol } from './spec-edit';

/** The body each size is meant for: girths per size. */
export function GirthsCard({
  spec, sizes, girths, unit, readOnly, onCommit, onPaste,
}: {
  spec: SizeSpec;
  sizes: readonly string[];
  girths: readonly GirthKey[];
  unit: LengthUnit;
  readOnly: boolean;
  onCommit: (rowId: string, colId: string, raw: string | null) => void;
  onPaste: (rowId: string, colId: string, grid: string[][], colIds: string[], rowIds: string[]) => void;
}) {
  const columns: GridColumn[] = sizes.map((s) => ({ id: sizeCol(s), header: s, accent: s === spec.baseSize }));
  const rows: GridRow[] = girths.map((g) => ({
    id: g,
    header: `${girthLabels[g]} girth`,
    cells: Object.fromEntries(
      sizes.map((s) => [sizeCol(s), { text: formatLength(spec.girths[s]?.[g], unit), editable: true, tone: 'plain' as const, label: `${girthLabels[g]} body girth, ${s}` }]),
    ),
  }));
  return (
    <Card title={`Body girths · ${unit}`}>
      <SpecGrid
        label="Body girths"
        rowHeader="Body"
        columns={columns}
        rows={rows}
        readOnly={readOnly}
        onCommit={onCommit}
        onPaste={(rowId, colId, grid) => onPaste(rowId, colId, grid, columns.map((c) => c.id), rows.map((r) => r.id))}
        testId="body-girths"
      />
      <p className="mt-2 text-2xs text-ink-faint">The body each size is made for, measured round. The compression estimate stretches the garment onto these.</p>
    </Card>
  );
}
