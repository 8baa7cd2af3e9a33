'use client';

import { useState } from 'react';
import { cutAndSewEquivalent, defaultSeamlessFactor, seamlessEquivalent } from '@/lib/fit/needles';
import { pointsOfMeasure, type PointKey } from '@/lib/fit/points';
import { resolvePoint } from '@/lib/fit/grading';
import type { SizeSpec } from '@/lib/fit/spec';
import { formatLength, type LengthUnit } from '@/lib/fit/units';
import type { StudioSeamlessFactor } from '@/lib/db/fit';
import { Card, Notice } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { SpecGrid, type GridColumn, type GridRow } from './spec-grid';
import { sizeCol } from './spec-edit';

/**
 * Cut-and-sew half-widths the designer knows fit, beside their seamless equivalent by the studio
 * factor; the equivalents can be taken into the spec. The factor itself is the studio's.
 */
export function CutAndSewCard({
  spec, sizes, points, unit, readOnly, factor, onCommit, onPaste, onUseEquivalents, onSaveFactor, factorBusy, factorError,
}: {
  spec: SizeSpec;
  sizes: readonly string[];
  points: readonly PointKey[];
  unit: LengthUnit;
  readOnly: boolean;
  factor: StudioSeamlessFactor;
  onCommit: (rowId: string, colId: string, raw: string | null) => void;
  onPaste: (rowId: string, colId: string, grid: string[][], colIds: string[], rowIds: string[]) => void;
  onUseEquivalents: () => void;
  onSaveFactor: (factor: number) => void;
  factorBusy: boolean;
  factorError: string | null;
}) {
  const [factorText, setFactorText] = useState<string | null>(null);
  const [open, setOpen] = useState(false);
  const columns: GridColumn[] = sizes.map((s) => ({ id: sizeCol(s), header: s, accent: s === spec.baseSize }));
  const rows: GridRow[] = points.flatMap((point) => {
    const label = pointsOfMeasure[point].label;
    const entries = spec.cutAndSew[point] ?? {};
    const specPoint = spec.points.find((p) => p.point === point);
    const resolved = specPoint ? resolvePoint(specPoint, sizes, spec.baseSize) : null;
    return [
      {
        id: `cs:${point}`,
        header: <span>{label} <span className="text-2xs font-normal text-ink-faint">cut-and-sew</span></span>,
        cells: Object.fromEntries(sizes.map((s) => [sizeCol(s), { text: formatLength(entries[s], unit), editable: true, tone: 'plain' as const, label: `Cut-and-sew ${label.toLowerCase()}, ${s}` }])),
      },
      {
        id: `eq:${point}`,
        muted: true,
        header: <span className="pl-3 text-xs font-normal text-ink-soft">→ seamless at ×{factor.factor.toFixed(3)}</span>,
        cells: Object.fromEntries(
          sizes.map((s) => {
            const cs = entries[s];
            const eq = cs === undefined ? null : seamlessEquivalent(cs, factor.factor);
            const inSpec = resolved?.[s]?.valueCm ?? null;
            const same = eq !== null && inSpec !== null && Math.abs(inSpec - eq) < 0.05;
            return [sizeCol(s), {
              text: formatLength(eq, unit), editable: false, tone: 'derived' as const, label: `Seamless equivalent ${label.toLowerCase()}, ${s}`,
              title: eq === null ? undefined : same ? 'The spec has this value' : `The spec has ${formatLength(inSpec, unit) || 'no value'}`,
            }];
          }),
        ),
      },
    ];
  });
  const hasEntries = Object.values(spec.cutAndSew).some((v) => v && Object.keys(v).length > 0);
  const shown = open || hasEntries;
  const parsed = factorText === null ? factor.factor : Number(factorText.replace(',', '.'));
  const factorValid = Number.isFinite(parsed) && parsed >= 0.5 && parsed <= 1.2;
  return (
    <Card
      title={`Cut-and-sew → seamless · ${unit}`}
      actions={
        !shown ? (
          readOnly ? null : <Button size="sm" onClick={() => setOpen(true)}>Enter cut-and-sew measurements</Button>
        ) : readOnly ? null : (
          <Button size="sm" onClick={onUseEquivalents} disabled={!hasEntries}>Use seamless values in the spec</Button>
        )
      }
    >
      {shown ? (
      <SpecGrid
        label="Cut-and-sew entries"
        rowHeader="Half-width"
        columns={columns}
        rows={rows}
        readOnly={readOnly}
        onCommit={onCommit}
        onPaste={(rowId, colId, grid) => onPaste(rowId, colId, grid, columns.map((c) => c.id), rows.map((r) => r.id))}
        testId="cut-and-sew"
      />
      ) : (
        <p className="text-sm text-ink-soft">Half-widths of a cut-and-sew garment known to fit, converted to their seamless equivalent. None entered.</p>
      )}
      <div className="mt-3 flex flex-wrap items-end gap-3 border-t border-rule pt-3">
        <label className="text-xs text-ink-soft">
          <span className="mb-1 block font-medium">Studio factor (seamless ÷ cut-and-sew)</span>
          <Input
            aria-label="Studio seamless factor"
            className="figures w-28 text-right"
            inputMode="decimal"
            disabled={readOnly}
            value={factorText ?? factor.factor.toFixed(4)}
            onChange={(e) => setFactorText(e.target.value)}
          />
        </label>
        {readOnly ? null : (
          <Button
            size="sm"
            disabled={factorBusy || factorText === null || !factorValid}
            onClick={() => { onSaveFactor(parsed); setFactorText(null); }}
          >
            Save for the studio
          </Button>
        )}
        <p className="max-w-md text-2xs leading-snug text-ink-faint">
          {factor.isDefault ? 'Common practice, no published source: ' : `Set by the studio (common-practice default ${defaultSeamlessFactor.toFixed(4)}): `}
          a seamless chest half-width of {formatLength(seamlessEquivalent(cutAndSewEquivalent(48.26, defaultSeamlessFactor), factor.factor), 'in')} in
          fits like a {formatLength(cutAndSewEquivalent(48.26, defaultSeamlessFactor), 'in')} in cut-and-sew one — seamless knits stretch more.
          The factor applies to every style of the studio.
        </p>
      </div>
      {factorText !== null && !factorValid ? <div className="mt-2"><Notice tone="error">The factor must be a number from 0.5 to 1.2.</Notice></div> : null}
      {factorError ? <div className="mt-2"><Notice tone="error">{factorError}</Notice></div> : null}
    </Card>
  );
}
