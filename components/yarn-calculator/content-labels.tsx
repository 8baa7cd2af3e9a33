'use client';

import { labelCaution, type ContentLabel, type ContentMethod } from '@/lib/knit/content';
import { fibres, type FibreId } from '@/lib/knit/fibres';
import type { YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { Card } from '@/components/ui/card';
import { grams, num } from './format';

const regions = {
  eu: { title: 'EU label', rule: 'Regulation (EU) No 1007/2011' },
  us: { title: 'US label', rule: '16 CFR Part 303' },
} as const;

function LabelColumn({ label, fibreGrams }: { label: ContentLabel; fibreGrams: Partial<Record<FibreId, number>> }) {
  const r = regions[label.region];
  const notes = label.notes.filter((n) => n !== labelCaution);
  return (
    <section className="min-w-0" aria-label={r.title} data-testid={`label-${label.region}`}>
      <header className="mb-2 flex items-baseline justify-between gap-2">
        <h3 className="text-[13px] font-semibold">{r.title}</h3>
        <span className="text-[11px] text-ink-faint">{r.rule}</span>
      </header>
      <p className="rounded-md border border-rule-strong bg-paper px-3 py-2.5 text-[15px] font-semibold leading-6 tracking-tight" data-testid={`label-text-${label.region}`}>
        {label.text}
      </p>
      <table className="mt-3 w-full text-xs">
        <thead className="text-ink-faint">
          <tr className="border-b border-rule">
            <th className="py-1 text-left font-medium">On the label</th>
            <th className="py-1 text-right font-medium">Exact share</th>
            <th className="py-1 text-right font-medium">Shown</th>
            <th className="py-1 text-right font-medium">g per garment</th>
          </tr>
        </thead>
        <tbody>
          {label.lines.map((l) => (
            <tr key={l.name} className="border-b border-rule/60 align-top">
              <td className="py-1 pr-2">
                {l.name}
                {l.fibres.length > 1 || l.other ? <div className="text-[11px] text-ink-faint">{l.fibres.map((f) => fibres[f].names[label.region]).join(', ')}</div> : null}
              </td>
              <td className="figures py-1 text-right">{num(l.exactPercent, 2)} %</td>
              <td className="figures py-1 text-right font-semibold">{l.percent} %</td>
              <td className="figures py-1 text-right text-ink-soft">{grams(l.fibres.reduce((s, f) => s + (fibreGrams[f] ?? 0), 0))}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {notes.length ? (
        <ul className="mt-3 space-y-1.5 text-xs leading-5 text-ink-soft">
          {notes.map((n) => <li key={n} className="border-l-2 border-rule-strong pl-2">{n}</li>)}
        </ul>
      ) : null}
    </section>
  );
}

/**
 * The fibre-content label of the base size as painted: EU and US versions side by side, the exact
 * share behind each whole percentage, the notes on thresholds and tolerances, and the caution.
 */
export function ContentLabels({ figures, method }: { figures: YarnCalculatorFigures; method: ContentMethod }) {
  const content = figures.content;
  return (
    <Card
      title="Fibre-content label"
      actions={<span className="text-xs text-ink-faint">{method === 'nominal' ? 'nominal yarn counts' : 'EU agreed allowances (clean dry mass + Annex IX)'} · size {figures.baseSize}, inside the cut lines</span>}
    >
      {content ? (
        <>
          <div className="grid grid-cols-2 gap-6">
            <LabelColumn label={content.labels.eu} fibreGrams={content.fibreGrams} />
            <LabelColumn label={content.labels.us} fibreGrams={content.fibreGrams} />
          </div>
          {method === 'eu-allowance' ? (
            <p className="mt-3 text-xs text-ink-faint">
              Grams are the yarns’ nominal masses; the shares are on the EU basis: each fibre’s mass brought to clean dry mass by its moisture regain and raised by its agreed allowance.
            </p>
          ) : null}
          <p className="mt-4 rounded-md border border-ochre-500/30 bg-ochre-50 px-3 py-2 text-xs font-medium text-ochre-700" data-testid="label-caution">{labelCaution}</p>
        </>
      ) : (
        <p className="text-sm text-ink-soft">No content yet: {figures.problems[0] ?? 'assign textures in the body map.'}</p>
      )}
    </Card>
  );
}
