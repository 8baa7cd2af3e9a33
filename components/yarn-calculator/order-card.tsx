'use client';

import { useState } from 'react';
import type { YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { Card } from '@/components/ui/card';
import { ButtonLink } from '@/components/ui/button';
import { kg, money, num } from './format';

const head = 'px-3 py-1.5 text-[11px] font-medium uppercase tracking-[0.06em] text-ink-faint';
const th = `${head} text-right`;

/** One size's garments: typed freely, read as a whole number ≥ 0. */
function GarmentsInput({ size, value, onChange }: { size: string; value: number; onChange: (n: number) => void }) {
  const [text, setText] = useState(String(value));
  const n = Number(text);
  const bad = text.trim() !== '' && (!Number.isInteger(n) || n < 0);
  return (
    <input
      aria-label={`Garments in size ${size}`}
      inputMode="numeric"
      value={text}
      aria-invalid={bad || undefined}
      onChange={(e) => {
        setText(e.target.value);
        const v = e.target.value.trim() === '' ? 0 : Number(e.target.value);
        if (Number.isInteger(v) && v >= 0) onChange(v);
      }}
      className="figures h-8 w-20 rounded-md border border-rule-strong bg-panel px-2 text-right text-sm focus:border-spruce-500 focus:outline-none focus:ring-2 focus:ring-spruce-100 aria-[invalid=true]:border-madder-500"
    />
  );
}

/** The order for a run: garments per size (editable) → kg per yarn, rounded up to 0.1 kg; CSV download. */
export function OrderCard({ figures, sizes, garments, onGarments, yarnName, pricesPerKg, csvHref }: {
  figures: YarnCalculatorFigures; sizes: readonly string[]; garments: Record<string, number>;
  onGarments: (size: string, n: number) => void; yarnName: (id: string) => string;
  /** Studio accounts only. */
  pricesPerKg?: Readonly<Record<string, number>>;
  csvHref: string;
}) {
  const showCost = !!pricesPerKg;
  const order = figures.order;
  const approx = figures.sizes.filter((s) => s.basis === 'base-grams' && (garments[s.size] ?? 0) > 0).map((s) => s.size);
  const yarnIds = order ? Object.entries(order.yarns).sort((a, b) => b[1].grams - a[1].grams).map(([id]) => id) : [];
  return (
    <Card
      title="Order for a run"
      actions={<ButtonLink href={csvHref} className="h-7 px-2.5 text-xs">Download CSV</ButtonLink>}
    >
      <table className="w-full text-sm" data-testid="order-table">
        <thead className="border-b border-rule">
          <tr>
            <th className={`${head} pl-0 text-left`}>Garments</th>
            {sizes.map((s) => <th key={s} className={th}><span className="figures text-[13px] normal-case tracking-normal">{s}</span></th>)}
            <th className={th}>Run</th>
            <th className={th}>To order</th>
            {showCost ? <th className={th}>Cost</th> : null}
          </tr>
          <tr>
            <td className="pb-2 pr-3 text-xs text-ink-soft">per size</td>
            {sizes.map((s) => (
              <td key={s} className="px-3 pb-2 text-right">
                <GarmentsInput size={s} value={garments[s] ?? 0} onChange={(n) => onGarments(s, n)} />
              </td>
            ))}
            <td className="figures px-3 pb-2 text-right font-semibold">{num(order?.totalGarments ?? 0)}</td>
            <td />
            {showCost ? <td /> : null}
          </tr>
        </thead>
        <tbody>
          {yarnIds.map((id) => {
            const o = order!.yarns[id]!;
            return (
              <tr key={id} className="border-b border-rule/60">
                <td className="py-1.5 pr-3">{yarnName(id)}</td>
                {sizes.map((s) => (
                  <td key={s} className="figures px-3 py-1.5 text-right text-ink-soft">{o.gramsBySize[s] ? kg(o.gramsBySize[s]! / 1000) : '—'}</td>
                ))}
                <td className="figures px-3 py-1.5 text-right">{num(o.grams / 1000, 2)}</td>
                <td className="figures px-3 py-1.5 text-right font-semibold">{kg(o.kg)}</td>
                {showCost ? <td className="figures px-3 py-1.5 text-right text-ink-soft">{pricesPerKg?.[id] === undefined ? '—' : money(o.kg * pricesPerKg[id])}</td> : null}
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr className="border-t border-rule-strong font-semibold">
            <td className="py-1.5 pr-3">All yarns, kg</td>
            {sizes.map((s) => <td key={s} />)}
            <td />
            <td className="figures px-3 py-1.5 text-right" data-testid="order-kg">{kg(order?.kg ?? 0)}</td>
            {showCost ? <td className="figures px-3 py-1.5 text-right">{order?.cost === undefined ? '—' : money(order.cost)}</td> : null}
          </tr>
        </tfoot>
      </table>
      <p className="mt-3 text-xs leading-5 text-ink-faint">
        Per size: grams per garment × garments, in kg. To order: the run rounded up to 0.1 kg per yarn; round up again to whole cones or bags with the spinner.
        {approx.length ? <span className="text-ochre-700"> {approx.join(', ')} use the base size’s grams (no graded spec).</span> : null}
      </p>
    </Card>
  );
}
