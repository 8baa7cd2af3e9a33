'use client';

import type { FlatSizeNeedles, SeamlessSizeNeedles, SizeCompression } from '@/lib/fit/fit-sheet';
import { pointsOfMeasure } from '@/lib/fit/points';
import { Card } from '@/components/ui/card';
import { int } from './format';
import { CompressionCaution } from './caution';

/** One line per size: the cylinder and needles that decide it, and the pressure range against the band. */
export function SummaryCard({ sizes, seamless, flat, pressure }: {
  sizes: readonly string[];
  seamless: SeamlessSizeNeedles[] | null;
  flat: FlatSizeNeedles[] | null;
  pressure: SizeCompression[] | null;
}) {
  const decidedBy = seamless?.[0]?.decidedBy;
  return (
    <Card title="Per size">
      <table className="w-full text-xs" data-testid="fit-summary">
        <thead className="text-ink-faint">
          <tr>
            <th className="py-0.5 text-left font-normal">Size</th>
            {seamless ? <th className="text-right font-normal">Cylinder</th> : null}
            <th className="text-right font-normal" title={decidedBy ? `Needles across the ${pointsOfMeasure[decidedBy].label.toLowerCase()}` : 'Needles per course at the chest'}>Needles</th>
            <th className="text-right font-normal">mmHg†</th>
          </tr>
        </thead>
        <tbody className="figures">
          {sizes.map((size) => {
            const s = seamless?.find((r) => r.size === size);
            const f = flat?.find((r) => r.size === size);
            const needles = s ? s.points.find((p) => p.point === s.decidedBy)?.needlesAcrossHalfWidth : f?.widths[0]?.needles;
            const p = pressure?.find((r) => r.size === size);
            const values = p?.girths.map((g) => g.estimate.pressureMmHg) ?? [];
            const off = p?.girths.filter((g) => g.finding).length ?? 0;
            return (
              <tr key={size} className="border-t border-rule/70">
                <td className="py-1 font-semibold">{size}</td>
                {seamless ? <td className="text-right">{s?.cylinder ? `${s.cylinder.diameterIn}″ · ${int.format(s.cylinder.needles)}` : '—'}</td> : null}
                <td className="text-right">{needles !== undefined ? int.format(needles) : '—'}</td>
                <td className={`text-right ${off ? 'font-semibold text-ochre-700' : ''}`}>
                  {values.length ? `${Math.min(...values).toFixed(1)}–${Math.max(...values).toFixed(1)}` : '—'}
                  {off ? <span className="ml-1 rounded bg-ochre-50 px-1 font-sans text-2xs" title={`${off} ${off === 1 ? 'girth' : 'girths'} outside the target band`}>{off} off</span> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <div className="mt-2"><CompressionCaution compact /></div>
    </Card>
  );
}
