'use client';

import type { SizeFigures, YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { grams, money, num } from './format';

const head = 'px-3 py-1.5 text-[11px] font-medium uppercase tracking-[0.06em] text-ink-faint';
const th = `${head} text-right`;

/** How a size's figures were found, for the column head. */
function basisNote(s: SizeFigures): string {
  switch (s.basis) {
    case 'drawn':
      return 'as drawn';
    case 'graded': {
      const factors = [...new Set(s.panels.map((p) => p.factor ?? 1).map((f) => f.toFixed(3)))];
      return `× ${factors.join(' · ')}`;
    }
    case 'base-grams':
      return '≈ base';
  }
}

/** Grams of each yarn per garment, one column per size, with the waste allowance. */
export function SizeTable({ figures, yarnName, showCost }: { figures: YarnCalculatorFigures; yarnName: (id: string) => string; showCost: boolean }) {
  const base = figures.sizes.find((s) => s.basis === 'drawn')?.consumption;
  const yarnIds = base ? Object.entries(base.yarns).sort((a, b) => b[1].grossGrams - a[1].grossGrams).map(([id]) => id) : [];
  if (!base) return <p className="text-sm text-ink-soft">No figures: {figures.problems[0] ?? 'assign textures in the body map.'}</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="size-grams">
        <thead className="border-b border-rule">
          <tr>
            <th className={`${head} pl-0 text-left`}>Yarn</th>
            {figures.sizes.map((s) => (
              <th key={s.size} className={`${th} ${s.basis === 'drawn' ? 'text-ink' : ''}`} scope="col">
                <div className="figures text-[13px] normal-case tracking-normal">{s.size}</div>
                <div className={`figures text-[10px] normal-case tracking-normal ${s.basis === 'base-grams' ? 'text-ochre-700' : 'text-ink-faint'}`}>{basisNote(s)}</div>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {yarnIds.map((id) => (
            <tr key={id} className="border-b border-rule/60">
              <td className="py-1.5 pr-3">{yarnName(id)}</td>
              {figures.sizes.map((s) => {
                const g = s.consumption?.yarns[id]?.grossGrams;
                return (
                  <td key={s.size} className={`figures px-3 py-1.5 text-right ${s.basis === 'drawn' ? 'bg-spruce-50/60' : ''} ${s.basis === 'base-grams' ? 'text-ink-soft' : ''}`}>
                    {g === undefined ? '—' : `${s.basis === 'base-grams' ? '≈ ' : ''}${grams(g)}`}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t border-rule-strong font-semibold">
            <td className="py-1.5 pr-3">Garment</td>
            {figures.sizes.map((s) => (
              <td key={s.size} className={`figures px-3 py-1.5 text-right ${s.basis === 'drawn' ? 'bg-spruce-50/60' : ''}`}>
                {s.consumption ? grams(s.consumption.grossGrams) : '—'}
              </td>
            ))}
          </tr>
          <tr className="text-xs text-ink-soft">
            <td className="py-1 pr-3">of which kept in the garment</td>
            {figures.sizes.map((s) => (
              <td key={s.size} className="figures px-3 py-1 text-right">{s.consumption ? grams(s.consumption.keptGrams) : '—'}</td>
            ))}
          </tr>
          {showCost ? (
            <tr className="text-xs text-ink-soft" data-testid="cost-per-garment">
              <td className="py-1 pr-3">Yarn cost per garment</td>
              {figures.sizes.map((s) => (
                <td key={s.size} className="figures px-3 py-1 text-right">{s.costPerGarment === undefined ? '—' : money(s.costPerGarment)}</td>
              ))}
            </tr>
          ) : null}
        </tfoot>
      </table>
      {showCost && figures.unpricedYarnIds && figures.unpricedYarnIds.length > 0 ? (
        <p className="mt-2 text-xs text-ink-faint">No cost: {figures.unpricedYarnIds.map(yarnName).join(', ')} {figures.unpricedYarnIds.length === 1 ? 'has' : 'have'} no price per kg in the library.</p>
      ) : null}
      <p className="mt-2 text-xs text-ink-faint">
        Under each graded size: its stitch factor against {figures.baseSize} ({[...new Set(figures.sizes.find((s) => s.basis === 'graded')?.panels.map((p) => (p.kind.startsWith('sleeve') ? 'sleeves' : p.kind.startsWith('leg') ? 'legs' : 'body')) ?? [])].join(' · ') || 'per panel'}).
        Kept: the yarn in the stitches inside the cut lines, <span className="figures">{num(figures.wasteAllowance * 100, 1)} %</span> allowance excluded.
      </p>
    </div>
  );
}
