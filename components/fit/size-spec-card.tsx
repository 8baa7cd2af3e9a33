'use client';

import { resolvePoint } from '@/lib/fit/grading';
import { pointsOfMeasure, type PointKey } from '@/lib/fit/points';
import type { SizeSpec } from '@/lib/fit/spec';
import { formatLength, type LengthUnit } from '@/lib/fit/units';
import { Card } from '@/components/ui/card';
import { SpecGrid, type GridColumn, type GridRow } from './spec-grid';
import { sizeCol } from './spec-edit';
import { signedLen } from './format';

/** The points of measure × sizes, graded from the base size, with grade and tolerance per point. */
export function SizeSpecCard({
  spec, sizes, unit, readOnly, onCommit, onPaste, onClearRow, actions,
}: {
  spec: SizeSpec;
  sizes: readonly string[];
  unit: LengthUnit;
  readOnly: boolean;
  onCommit: (rowId: string, colId: string, raw: string | null) => void;
  onPaste: (rowId: string, colId: string, grid: string[][], colIds: string[], rowIds: string[]) => void;
  onClearRow: (point: PointKey) => void;
  actions?: React.ReactNode;
}) {
  const columns: GridColumn[] = [
    { id: 'grade', header: 'Grade', title: `Added per size step going up, ${unit}` },
    { id: 'tol', header: 'Tol. ±', title: `Plus or minus tolerance, ${unit}` },
    ...sizes.map((s) => ({
      id: sizeCol(s),
      header: s === spec.baseSize ? <span>{s}<span className="ml-1 text-2xs font-normal uppercase tracking-wide">base</span></span> : s,
      accent: s === spec.baseSize,
    })),
  ];
  const rows: GridRow[] = spec.points.map((p) => {
    const pom = pointsOfMeasure[p.point];
    const resolved = resolvePoint(p, sizes, spec.baseSize);
    const overrides = Object.keys(p.overrides).filter((s) => sizes.includes(s) && s !== spec.baseSize).length;
    const cells: GridRow['cells'] = {
      grade: {
        text: signedLen(p.gradeCm, unit), editText: formatLength(p.gradeCm, unit), editable: true, tone: 'plain',
        label: `${pom.label} grade`,
      },
      tol: {
        text: `±${formatLength(p.toleranceCm, unit)}`, editText: formatLength(p.toleranceCm, unit), editable: true, tone: 'plain',
        label: `${pom.label} tolerance`,
      },
    };
    for (const s of sizes) {
      const c = resolved[s]!;
      const invalid = c.valueCm !== null && c.valueCm <= 0;
      cells[sizeCol(s)] = {
        text: invalid ? '≤ 0' : formatLength(c.valueCm, unit),
        editText: invalid ? '' : formatLength(c.valueCm, unit),
        editable: true,
        tone: invalid ? 'invalid' : s === spec.baseSize ? 'base' : c.overridden ? 'override' : 'graded',
        label: `${pom.label}, ${s}`,
        title: invalid
          ? 'The grade takes this size to zero or below'
          : c.overridden
            ? `Set by hand; grading gives ${formatLength(c.gradedCm, unit)} ${unit}. Delete to grade it again.`
            : s === spec.baseSize ? 'Base size: the other sizes grade from here' : `Graded from ${spec.baseSize}`,
      };
    }
    return {
      id: p.point,
      header: pom.label,
      trailing:
        overrides > 0 && !readOnly ? (
          <button
            type="button"
            onClick={() => onClearRow(p.point)}
            title={`Grade ${pom.label.toLowerCase()} from ${spec.baseSize} again (drops ${overrides} hand-set ${overrides === 1 ? 'value' : 'values'})`}
            aria-label={`Grade ${pom.label.toLowerCase()} from the base again`}
            className="rounded px-1 text-xs text-ink-faint hover:bg-rule/60 hover:text-ink"
          >
            ↺
          </button>
        ) : null,
      cells,
    };
  });
  const colIds = columns.map((c) => c.id);
  const rowIds = rows.map((r) => r.id);
  return (
    <Card title={`Size spec · ${unit}`} actions={actions}>
      <SpecGrid
        label="Size spec"
        rowHeader="Point of measure"
        columns={columns}
        rows={rows}
        readOnly={readOnly}
        onCommit={onCommit}
        onPaste={(rowId, colId, grid) => onPaste(rowId, colId, grid, colIds, rowIds)}
        testId="size-spec"
      />
      <div className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-2xs text-ink-faint">
        <span><span className="font-semibold text-ink">bold</span> base size {spec.baseSize}</span>
        <span className="text-ink-soft">grey: graded from {spec.baseSize}</span>
        <span><span className="mr-1 inline-block h-1.5 w-1.5 rounded-full bg-indigo-thread align-middle" /><span className="text-indigo-thread">set by hand</span></span>
        <span>Half-widths measured flat, relaxed. Grades and tolerances start from common practice (no published source).</span>
        {readOnly ? null : <span>Arrows move · Enter edits · Delete clears · paste a block from a spreadsheet at the active cell</span>}
      </div>
    </Card>
  );
}
