'use client';

import { useMemo, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api/client';
import type { LabDip, LabDipStatus } from '@/lib/db/lab-dips';
import { toleranceFormulaLabel as formulaLabel, toleranceLabel } from '@/lib/colour/difference';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { Input } from '@/components/ui/field';
import { PairSwatch, fmtLab } from './swatch';
import { colourKeys } from './use-colour';

const statusStyle: Record<LabDipStatus, string> = {
  submitted: 'bg-ochre-50 text-ochre-700 ring-1 ring-ochre-500/25',
  approved: 'bg-spruce-600 text-white',
  rejected: 'bg-madder-50 text-madder-700 ring-1 ring-madder-500/25',
};
const statusLabels: Record<LabDipStatus, string> = { submitted: 'Awaiting decision', approved: 'Approved', rejected: 'Rejected' };

const signed = (n: number) => `${n >= 0 ? '+' : '−'}${Math.abs(n).toFixed(2)}`;

const col = createColumnHelper<LabDip>();

/** The style's lab dips (of one colourway when given), with the numbers and words, and the decision. */
export function LabDipsTable({
  styleId,
  labDips,
  canDecide,
  showSubmitter,
}: {
  styleId: string;
  labDips: readonly LabDip[];
  canDecide: boolean;
  showSubmitter: boolean;
}) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const columns = useMemo(
    () => [
      col.accessor((d) => `${d.targetName} ${d.sequence}`, {
        id: 'dip',
        header: 'Dip',
        cell: ({ row: { original: d } }) => (
          <div className="flex items-center gap-2.5">
            <PairSwatch target={d.targetLab} sample={d.measured} />
            {d.photoFileId ? (
              <a href={`/api/files/${d.photoFileId}`} target="_blank" rel="noreferrer" title="Photo of the dip" className="shrink-0">
                {/* eslint-disable-next-line @next/next/no-img-element -- a private file behind an access check, not an optimisable asset */}
                <img src={`/api/files/${d.photoFileId}`} alt={`Photo of ${d.targetName} #${d.sequence}`} className="h-9 w-9 rounded-[5px] object-cover ring-1 ring-inset ring-black/15" loading="lazy" />
              </a>
            ) : null}
            <div className="leading-tight">
              <div className="font-medium">{d.targetName} <span className="figures text-ink-faint">#{d.sequence}</span></div>
              <div className="figures whitespace-nowrap text-2xs leading-4 text-ink-faint" title="L* / a* / b*">
                <div>target {fmtLab(d.targetLab)}</div>
                <div>dip&nbsp;&nbsp;&nbsp; {fmtLab(d.measured)}</div>
              </div>
            </div>
          </div>
        ),
      }),
      // The verdict and its number come from one formula, the tolerance's own; the other formula
      // is shown beside it for reference.
      col.accessor((d) => d.reading.deltaE, {
        id: 'deltaE',
        header: 'ΔE (tolerance)',
        cell: ({ row: { original: d } }) => (
          <div className="leading-tight" data-formula={d.tolerance.formula}>
            <div className={`figures whitespace-nowrap text-sm font-semibold ${d.reading.pass ? 'text-spruce-700' : 'text-madder-700'}`}>
              <span className="text-2xs font-normal">{formulaLabel(d.tolerance)}</span> {d.reading.deltaE.toFixed(2)}
            </div>
            <div className="whitespace-nowrap text-2xs text-ink-faint">{d.reading.pass ? 'within' : 'outside'} {toleranceLabel(d.tolerance)}</div>
          </div>
        ),
      }),
      col.accessor((d) => (d.tolerance.formula === 'cmc' ? d.reading.deltaE2000 : d.reading.deltaECMC21), {
        id: 'other',
        header: 'Other formula',
        cell: ({ row: { original: d } }) => (
          <span className="figures whitespace-nowrap text-xs text-ink-soft">
            {d.tolerance.formula === 'cmc' ? `ΔE00 ${d.reading.deltaE2000.toFixed(2)}` : `CMC(2:1) ${d.reading.deltaECMC21.toFixed(2)}`}
          </span>
        ),
      }),
      col.display({
        id: 'components',
        header: 'ΔL* ΔC* ΔH*',
        cell: ({ row: { original: d } }) => {
          const r = d.reading;
          const parts: [string, number, string][] = [
            ['ΔL', r.components.dL, r.words.lightness === 'same' ? 'same lightness' : r.words.lightness],
            ['ΔC', r.components.dC, r.words.chroma === 'same' ? 'same strength' : r.words.chroma],
            ['ΔH', r.components.dH, r.hue ?? 'same hue'],
          ];
          return (
            <dl className="grid grid-cols-[auto_auto_1fr] gap-x-2 text-xs leading-5">
              {parts.map(([k, v, w]) => (
                <div key={k} className="contents">
                  <dt className="text-ink-faint">{k}</dt>
                  <dd className="figures text-right">{signed(v)}</dd>
                  <dd className="text-ink-soft">{w}</dd>
                </div>
              ))}
            </dl>
          );
        },
      }),
      col.accessor('submittedAt', {
        header: 'Sent',
        cell: ({ row: { original: d } }) => (
          <div className="leading-tight">
            <time className="figures whitespace-nowrap text-xs" dateTime={d.submittedAt}>{d.submittedAt.slice(0, 10)}</time>
            {showSubmitter ? <div className="text-2xs text-ink-faint">{d.organisationName ?? d.submittedByName ?? '—'}</div> : null}
            {d.readings.length > 1 ? <div className="text-2xs text-ink-faint">mean of {d.readings.length} readings</div> : null}
          </div>
        ),
      }),
      col.accessor('status', {
        header: 'Decision',
        cell: ({ row: { original: d } }) => <Decision styleId={styleId} dip={d} canDecide={canDecide} />,
      }),
    ],
    [styleId, canDecide, showSubmitter],
  );
  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance stays inside this component
  const table = useReactTable({
    data: labDips as LabDip[],
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  if (labDips.length === 0) return <p className="text-sm text-ink-soft">No lab dips yet. The dye house sends them for each target.</p>;
  return (
    <div className="-mx-4 overflow-x-auto">
      <table className="w-full text-left text-sm" aria-label="Lab dips">
        <thead className="border-y border-rule bg-paper/60 text-xs text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} scope="col" className="px-4 py-2 font-medium">
                  {h.column.getCanSort() ? (
                    <button type="button" className="hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden className="ml-1 text-ink-faint">{h.column.getIsSorted() === 'asc' ? '▲' : h.column.getIsSorted() === 'desc' ? '▼' : ''}</span>
                    </button>
                  ) : (
                    flexRender(h.column.columnDef.header, h.getContext())
                  )}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-rule/70 align-top" data-testid="lab-dip-row" data-status={row.original.status}>
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2.5">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {labDips.some((d) => d.comment) ? (
        <ul className="mt-3 space-y-1 px-4 text-xs text-ink-soft">
          {labDips.filter((d) => d.comment).map((d) => (
            <li key={d.id}><span className="font-medium text-ink">{d.targetName} #{d.sequence}:</span> {d.comment}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function Decision({ styleId, dip, canDecide }: { styleId: string; dip: LabDip; canDecide: boolean }) {
  const qc = useQueryClient();
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const decide = async (decision: 'approved' | 'rejected') => {
    setError(null);
    setBusy(true);
    try {
      await api(`/api/styles/${styleId}/lab-dips/${dip.id}`, { method: 'PATCH', json: { version: dip.version, decision, comment } });
      await Promise.all([
        qc.invalidateQueries({ queryKey: colourKeys.labDips(styleId) }),
        qc.invalidateQueries({ queryKey: colourKeys.colourways(styleId) }),
      ]);
    } catch (err) {
      setError(err instanceof ApiError ? (err.fieldErrors.comment?.[0] ?? err.message) : 'That did not work; try again.');
      if (err instanceof ApiError && err.status === 409) await qc.invalidateQueries({ queryKey: colourKeys.labDips(styleId) });
    } finally {
      setBusy(false);
    }
  };

  const badge = <span className={`inline-flex whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium ${statusStyle[dip.status]}`}>{statusLabels[dip.status]}</span>;
  if (dip.status !== 'submitted' || !canDecide) {
    return (
      <div className="max-w-64 space-y-1 leading-tight">
        {badge}
        {dip.decidedByName ? <div className="text-2xs text-ink-faint">{dip.decidedByName} · <time className="figures">{dip.decidedAt?.slice(0, 10)}</time></div> : null}
        {dip.decisionComment ? <div className="text-xs text-ink-soft">{dip.decisionComment}</div> : null}
      </div>
    );
  }
  return (
    <div className="w-64 space-y-1.5">
      {badge}
      <p className="text-2xs text-ink-faint">{dip.reading.summary}</p>
      <Input
        aria-label={`Comment on ${dip.targetName} #${dip.sequence}`}
        placeholder="Comment (required to reject)"
        className="h-8 text-xs"
        value={comment}
        onChange={(e) => setComment(e.target.value)}
      />
      <div className="flex gap-1.5">
        <Button size="sm" variant="primary" disabled={busy} onClick={() => decide('approved')}>Approve</Button>
        <Button size="sm" variant="danger" disabled={busy} onClick={() => decide('rejected')}>Reject</Button>
      </div>
      {error ? <Notice tone="error">{error}</Notice> : null}
    </div>
  );
}
